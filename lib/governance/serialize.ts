import { checkExpression } from '@/lib/engine/expressions';
import { toTex, symbolTex } from '@/lib/engine/expressions';
import type { Definition } from '@/lib/engine/types';

/** TeX for every step and output of a definition, for typesetting; undefined where an expression is invalid. */
export function definitionTex(def: Definition): Record<string, string> {
  const out: Record<string, string> = {};
  const declared = new Set<string>([
    ...def.inputs.map((i) => i.symbol), ...(def.constants ?? []).map((c) => c.symbol),
    ...(def.steps ?? []).map((s) => s.symbol), ...def.outputs.map((o) => o.symbol),
  ]);
  const put = (symbol: string, src: string, lhs?: string) => {
    try {
      out[symbol] = `${lhs ?? symbolTex(symbol)} = ${toTex(checkExpression(src, declared).node)}`;
    } catch {
      /* leave it out; validation reports the problem */
    }
  };
  for (const s of def.steps ?? []) {
    if (s.kind === 'expression') put(s.symbol, s.expression);
    else if (s.kind === 'solve') put(s.symbol, s.residual, '0');
    else out[s.symbol] = `${symbolTex(s.symbol)} = \\text{${s.column} from table ${s.table} at }${symbolTex(s.at)}`;
  }
  for (const o of def.outputs) put(o.symbol, o.expression);
  return out;
}

/** One line per bounded symbol, e.g. "1e4 ≤ Re_D ≤ 5e6; Pr ≥ 0.6". */
export function validitySummary(def: Definition): string {
  return (def.validity ?? []).map((l) => {
    const lo = l.min !== undefined ? `${fmt(l.min)} ${l.minInclusive === false ? '<' : '≤'} ` : '';
    const hi = l.max !== undefined ? ` ${l.maxInclusive === false ? '<' : '≤'} ${fmt(l.max)}` : '';
    return `${lo}${l.symbol}${hi}`;
  }).join('; ');
}

function fmt(x: number): string {
  const a = Math.abs(x);
  return a !== 0 && (a >= 1e5 || a < 1e-3) ? x.toExponential().replace('e+', 'e') : String(x);
}
