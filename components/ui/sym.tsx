'use client';

import { Tex } from '@/components/ui/tex';
import { symbolTex } from '@/lib/engine/tex-symbols';
import { isDimensionless } from '@/lib/client/units';

/**
 * A symbol typeset as engineers write it (Nu_L → Nu with a subscript L, nu → ν, rho → ρ, c_p → c with subscript p).
 * Screen readers get the symbol's plain name; the typeset form is for the eye.
 */
export function Sym({ s }: { s: string }) {
  return (
    <span title={s} className="whitespace-nowrap">
      <span aria-hidden="true"><Tex tex={symbolTex(s)} /></span>
      <span className="sr-only">{s}</span>
    </span>
  );
}

export function UnitText({ unit }: { unit: string }) {
  return <span className="text-xs text-ink-soft">{isDimensionless(unit) ? '—' : unit}</span>;
}
