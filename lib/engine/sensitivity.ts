import type { MathNode } from 'mathjs';
import { BUILTIN_CONSTANTS, FUNCTIONS } from './expressions';
import { brent, interpolate } from './solve';
import type { CompiledDefinition } from './compile';

/**
 * Forward-mode automatic differentiation over the checked expression trees: every value carries its
 * gradient with respect to n chosen variables (dual numbers), so derivatives are exact to rounding —
 * no finite differences, no step to guess. Used for sensitivities and first-order propagation of
 * accuracy bands (lib/engine/uncertainty.ts). A branch (a ? b : c, min, max, a table segment) is
 * differentiated on the side the value takes: the derivative is local, as first-order propagation is.
 */
export interface Dual {
  v: number;
  d: Float64Array;
}

export const constant = (v: number, n: number): Dual => ({ v, d: new Float64Array(n) });
export const variable = (v: number, n: number, i: number): Dual => { const d = new Float64Array(n); d[i] = 1; return { v, d }; };

const lin = (a: Dual, ka: number, b: Dual | null, kb: number, v: number): Dual => {
  const d = new Float64Array(a.d.length);
  for (let i = 0; i < d.length; i++) d[i] = ka * a.d[i] + (b ? kb * b.d[i] : 0);
  return { v, d };
};
const chain1 = (a: Dual, v: number, dv: number): Dual => lin(a, dv, null, 0, v);

function pow(a: Dual, b: Dual): Dual {
  const v = a.v ** b.v;
  const bConst = b.d.every((x) => x === 0);
  // d(a^b) = b a^(b−1) da + a^b ln(a) db; the second term only when the exponent varies.
  const da = a.v === 0 ? (b.v === 1 ? 1 : b.v > 1 ? 0 : Infinity) : b.v * a.v ** (b.v - 1);
  return bConst ? chain1(a, v, da) : lin(a, da, b, v * Math.log(a.v), v);
}

const FUNCS: Record<string, (args: Dual[]) => Dual> = {
  sqrt: ([a]) => { const v = Math.sqrt(a.v); return chain1(a, v, 0.5 / v); },
  cbrt: ([a]) => { const v = Math.cbrt(a.v); return chain1(a, v, 1 / (3 * v * v)); },
  exp: ([a]) => { const v = Math.exp(a.v); return chain1(a, v, v); },
  log: ([a]) => chain1(a, Math.log(a.v), 1 / a.v),
  log10: ([a]) => chain1(a, Math.log10(a.v), 1 / (a.v * Math.LN10)),
  abs: ([a]) => chain1(a, Math.abs(a.v), Math.sign(a.v)),
  min: (args) => args.reduce((m, x) => (x.v < m.v ? x : m)),
  max: (args) => args.reduce((m, x) => (x.v > m.v ? x : m)),
  pow: ([a, b]) => pow(a, b),
  sin: ([a]) => chain1(a, Math.sin(a.v), Math.cos(a.v)),
  cos: ([a]) => chain1(a, Math.cos(a.v), -Math.sin(a.v)),
  tan: ([a]) => { const c = Math.cos(a.v); return chain1(a, Math.tan(a.v), 1 / (c * c)); },
  asin: ([a]) => chain1(a, Math.asin(a.v), 1 / Math.sqrt(1 - a.v * a.v)),
  acos: ([a]) => chain1(a, Math.acos(a.v), -1 / Math.sqrt(1 - a.v * a.v)),
  atan: ([a]) => chain1(a, Math.atan(a.v), 1 / (1 + a.v * a.v)),
  sinh: ([a]) => chain1(a, Math.sinh(a.v), Math.cosh(a.v)),
  cosh: ([a]) => chain1(a, Math.cosh(a.v), Math.sinh(a.v)),
  tanh: ([a]) => { const t = Math.tanh(a.v); return chain1(a, t, 1 - t * t); },
  sign: ([a]) => constant(Math.sign(a.v), a.d.length),
  // I0′ = I1, I1′ = I0 − I1/x, K0′ = −K1, K1′ = −K0 − K1/x (Abramowitz & Stegun 9.6.27).
  besselI0: ([a]) => chain1(a, FUNCTIONS.besselI0.impl(a.v), FUNCTIONS.besselI1.impl(a.v)),
  besselI1: ([a]) => { const i1 = FUNCTIONS.besselI1.impl(a.v); return chain1(a, i1, a.v === 0 ? 0.5 : FUNCTIONS.besselI0.impl(a.v) - i1 / a.v); },
  besselK0: ([a]) => chain1(a, FUNCTIONS.besselK0.impl(a.v), -FUNCTIONS.besselK1.impl(a.v)),
  besselK1: ([a]) => { const k1 = FUNCTIONS.besselK1.impl(a.v); return chain1(a, k1, -FUNCTIONS.besselK0.impl(a.v) - k1 / a.v); },
  hypot: (args) => {
    const v = Math.hypot(...args.map((x) => x.v));
    const d = new Float64Array(args[0].d.length);
    for (const x of args) for (let i = 0; i < d.length; i++) d[i] += v === 0 ? 0 : (x.v / v) * x.d[i];
    return { v, d };
  },
};

interface AnyNode { type: string; value?: unknown; name?: string; fn?: unknown; args?: AnyNode[]; content?: AnyNode; condition?: AnyNode; trueExpr?: AnyNode; falseExpr?: AnyNode }

/** Evaluates a checked tree on dual numbers; `scope` holds every symbol it reads. */
export function evaluateDual(node: MathNode, scope: ReadonlyMap<string, Dual>, n: number): Dual {
  const ev = (x: AnyNode): Dual => {
    switch (x.type) {
      case 'ConstantNode': return constant(x.value as number, n);
      case 'SymbolNode': {
        const s = scope.get(x.name!);
        if (s) return s;
        if (Object.hasOwn(BUILTIN_CONSTANTS, x.name!)) return constant(BUILTIN_CONSTANTS[x.name!], n);
        throw new Error(`unknown symbol "${x.name}"`);
      }
      case 'ParenthesisNode': return ev(x.content!);
      case 'ConditionalNode': return ev(x.condition!).v ? ev(x.trueExpr!) : ev(x.falseExpr!);
      case 'FunctionNode': return FUNCS[(x.fn as AnyNode).name!](x.args!.map(ev));
      case 'OperatorNode': {
        const fn = String(x.fn);
        const a = ev(x.args![0]);
        if (fn === 'unaryMinus') return lin(a, -1, null, 0, -a.v);
        if (fn === 'unaryPlus') return a;
        if (fn === 'not') return constant(a.v ? 0 : 1, n);
        const b = ev(x.args![1]);
        switch (fn) {
          case 'add': return lin(a, 1, b, 1, a.v + b.v);
          case 'subtract': return lin(a, 1, b, -1, a.v - b.v);
          case 'multiply': return lin(a, b.v, b, a.v, a.v * b.v);
          case 'divide': return lin(a, 1 / b.v, b, -a.v / (b.v * b.v), a.v / b.v);
          case 'pow': return pow(a, b);
          case 'larger': return constant(+(a.v > b.v), n);
          case 'smaller': return constant(+(a.v < b.v), n);
          case 'largerEq': return constant(+(a.v >= b.v), n);
          case 'smallerEq': return constant(+(a.v <= b.v), n);
          case 'equal': return constant(+(a.v === b.v), n);
          case 'unequal': return constant(+(a.v !== b.v), n);
          case 'and': return constant(+(Boolean(a.v) && Boolean(b.v)), n);
          case 'or': return constant(+(Boolean(a.v) || Boolean(b.v)), n);
          default: throw new Error(`operator ${fn} has no derivative rule`);
        }
      }
      default: throw new Error(`${x.type} has no derivative rule`);
    }
  };
  return ev(node as unknown as AnyNode);
}

/** Slope of the linear interpolation at x (the segment it falls in; the end segments beyond the table). */
function interpolationSlope(xs: ArrayLike<number>, ys: ArrayLike<number>, x: number): number {
  let k = 1;
  while (k < xs.length - 1 && x > xs[k]) k++;
  return (ys[k] - ys[k - 1]) / (xs[k] - xs[k - 1]);
}

/**
 * A definition's outputs as dual numbers, given its inputs as dual numbers (declared units, declared
 * order). Mirrors the generated evaluator step by step: expression steps, table look-ups (slope of the
 * segment), and implicit solves, whose derivative follows from the residual by the implicit function
 * theorem: dx/dp = −(∂F/∂p)/(∂F/∂x) at the root.
 */
export function definitionDual(c: CompiledDefinition, inputs: Dual[]): Record<string, Dual> {
  const n = inputs[0]?.d.length ?? 0;
  const { definition, analysed } = c;
  const scope = new Map<string, Dual>();
  definition.inputs.forEach((inp, i) => scope.set(inp.symbol, inputs[i]));
  for (const k of definition.constants ?? []) scope.set(k.symbol, constant(k.value, n));
  for (const { step, checked } of analysed.steps) {
    if (step.kind === 'expression') scope.set(step.symbol, evaluateDual(checked[0].node, scope, n));
    else if (step.kind === 'table') {
      const table = definition.tables!.find((t) => t.name === step.table)!;
      const xs = table.columns.find((col) => col.name === table.key)!.values;
      const ys = table.columns.find((col) => col.name === step.column)!.values;
      const at = scope.get(step.at)!;
      scope.set(step.symbol, chain1(at, interpolate(xs, ys, at.v), interpolationSlope(xs, ys, at.v)));
    } else {
      const [residual, lo, hi] = checked.map((k) => k.node);
      const valueAt = (x: number) => { scope.set(step.symbol, constant(x, n)); return evaluateDual(residual, scope, n).v; };
      const root = brent(valueAt, evaluateDual(lo, scope, n).v, evaluateDual(hi, scope, n).v);
      // ∂F/∂p: the residual at the root with x held fixed; ∂F/∂x: a one-variable dual in x alone.
      scope.set(step.symbol, constant(root, n));
      const fp = evaluateDual(residual, scope, n);
      const plain = new Map([...scope].map(([s, d]) => [s, constant(d.v, 1)]));
      plain.set(step.symbol, variable(root, 1, 0));
      const fx = evaluateDual(residual, plain, 1).d[0];
      scope.set(step.symbol, lin(fp, -1 / fx, null, 0, root));
    }
  }
  const out: Record<string, Dual> = {};
  for (const o of analysed.outputs) out[o.symbol] = evaluateDual(o.checked.node, scope, n);
  return out;
}
