'use client';

import { Tex } from '@/components/ui/tex';
import { symbolTex } from '@/lib/engine/tex-symbols';
import { isDimensionless } from '@/lib/client/units';

/** A symbol typeset as engineers write it (Nu_L → Nu_L with a subscript, nu → ν), with its unit. */
export function Sym({ s }: { s: string }) {
  return <span title={s}><Tex tex={symbolTex(s)} /></span>;
}

export function UnitText({ unit }: { unit: string }) {
  return <span className="text-xs text-ink-soft">{isDimensionless(unit) ? '—' : unit}</span>;
}
