import { checkExpression } from './expressions';
import { convert } from './units';
import { constant, definitionDual, evaluateDual, variable, type Dual } from './sensitivity';
import type { CompiledDefinition } from './compile';
import type { CompiledChain } from './chain';
import type { Accuracy, Definition } from './types';
import type { MathNode } from 'mathjs';
import type { ChainResult, CorrelationStep, ExpressionStep, LeafStep, Pin } from './template-types';

/**
 * Accuracy bands: what a correlation's stated accuracy says about each of its results, and how the
 * bands of every step of a calculation combine into the band of its results.
 *
 * A band is the stated relative accuracy of a correlation on its data (± rel), not a guarantee. Through
 * a chain each correlation step is given an independent relative error ε on each output, and a result
 * y moves by (∂y/∂ε) ε to first order; the bands combine as independent errors of the same coverage:
 * rel_y = √Σ (∂ln y/∂ε_i · rel_i)². The derivatives come from forward-mode automatic differentiation of
 * the checked expression trees (./sensitivity.ts), not from finite differences.
 */
export interface Band {
  rel: number;
  basis: string;
  approximates?: string;
}

/** The band of each output of a definition, from its stated accuracy (null: none stated). */
export function bandsOf(definition: Pick<Definition, 'accuracy' | 'outputs'>): Record<string, Band | null> {
  return Object.fromEntries(definition.outputs.map((o) => [o.symbol, bandOf(definition.accuracy, o.symbol)]));
}

export function bandOf(accuracy: Accuracy | undefined | null, symbol: string): Band | null {
  if (!accuracy) return null;
  const rel = accuracy.byOutput?.[symbol] ?? accuracy.rel;
  return { rel, basis: accuracy.basis, ...(accuracy.approximates ? { approximates: accuracy.approximates } : {}) };
}

export interface BudgetLine {
  /** The chain step and the output of it whose band this is. */
  step: string;
  title: string;
  symbol: string;
  correlation: Pin | null;
  /** The step's band on that output (null: no stated accuracy). */
  rel: number | null;
  basis: string | null;
  /** ∂ln(result)/∂ε: how much the result moves per relative error of this step output. */
  sensitivity: number;
  /** |sensitivity| × rel: this step's part of the result's band. */
  contribution: number | null;
  /** Share of the squared band (0–1). */
  share: number | null;
}

export interface PropagatedOutput {
  value: number;
  unit: string;
  /** The result's band, ± relative (null when no step with a band moves it). */
  rel: number | null;
  /** False when a step that moves this result states no accuracy: the band leaves it out. */
  complete: boolean;
  budget: BudgetLine[];
  /** ∂result/∂input (in declared units) and the elasticity ∂ln result/∂ln input. */
  sensitivities: Record<string, { derivative: number; elasticity: number; unit: string }>;
}

export interface Propagation {
  method: string;
  outputs: Record<string, PropagatedOutput>;
}

export const PROPAGATION_METHOD = 'first-order propagation of the stated accuracies (independent relative errors on every correlation step output, combined as √Σ(∂ln y/∂ε · rel)²), derivatives by forward-mode automatic differentiation of the expression trees';

interface ChainShape {
  /** Every leaf step by key, including those inside choices. */
  leaves: Map<string, LeafStep>;
  /** The checked tree of every expression-step output, by step key then output symbol. */
  trees: Map<string, MathNode[]>;
}
/** Parsed once per compiled chain (the chain compiler checked these expressions already): runs only evaluate. */
const shapes = new WeakMap<CompiledChain, ChainShape>();

function shapeOf(chain: CompiledChain): ChainShape {
  const known = shapes.get(chain);
  if (known) return known;
  const leaves = new Map<string, LeafStep>();
  for (const s of chain.definition.steps) {
    if (s.kind === 'choice') for (const o of s.options) for (const l of o.steps) leaves.set(l.key, l);
    else leaves.set(s.key, s);
  }
  const all = new Set(chain.units.keys());
  const trees = new Map([...leaves].filter(([, l]) => l.kind === 'expression')
    .map(([key, l]) => [key, (l as ExpressionStep).outputs.map((o) => checkExpression(o.expression, all).node)]));
  const shape = { leaves, trees };
  shapes.set(chain, shape);
  return shape;
}

/**
 * Propagates the bands of every step through one run of a chain. `resolve` gives the compiled
 * correlation of a pin (the same the chain was compiled with); `run` is chain.runDetailed(values).
 */
export function propagate(chain: CompiledChain, resolve: (pin: Pin) => CompiledDefinition, values: ArrayLike<number>, run: ChainResult = chain.runDetailed(values)): Propagation {
  const def = chain.definition;
  const { leaves, trees } = shapeOf(chain);
  const nIn = chain.inputSymbols.length;
  // One variable per chain input, then one per correlation step output (its relative error ε).
  const sources: { step: string; title: string; symbol: string; correlation: Pin; band: Band | null }[] = [];
  const sourceIndex = new Map<string, number>();
  for (const r of run.steps) {
    if (r.kind !== 'correlation') continue;
    const leaf = leaves.get(r.key) as CorrelationStep;
    const c = resolve(leaf.use);
    for (const [defOut, chainSym] of Object.entries(leaf.outputs)) {
      sourceIndex.set(`${r.key}\u0000${chainSym}`, sources.length);
      sources.push({ step: r.key, title: r.title, symbol: chainSym, correlation: leaf.use, band: bandOf(c.definition.accuracy, defOut) });
    }
  }
  const n = nIn + sources.length;
  const scope = new Map<string, Dual>();
  chain.inputSymbols.forEach((s, i) => scope.set(s, variable(values[i], n, i)));
  for (const k of def.constants ?? []) scope.set(k.symbol, constant(k.value, n));
  for (const r of run.steps) {
    const leaf = leaves.get(r.key)!;
    if (leaf.kind === 'correlation') {
      const c = resolve(leaf.use);
      const inputs = c.definition.inputs.map((inp) => {
        const from = leaf.inputs[inp.symbol];
        const x = scope.get(from)!;
        const unit = chain.units.get(from)!;
        const b = convert(0, unit, inp.unit);
        const a = convert(1, unit, inp.unit) - b;
        const d = new Float64Array(n);
        for (let i = 0; i < n; i++) d[i] = a * x.d[i];
        return { v: a * x.v + b, d };
      });
      const out = definitionDual(c, inputs);
      for (const [defOut, chainSym] of Object.entries(leaf.outputs)) {
        const y = out[defOut];
        const j = nIn + sourceIndex.get(`${r.key}\u0000${chainSym}`)!;
        const d = Float64Array.from(y.d);
        d[j] += y.v;
        scope.set(chainSym, { v: y.v, d });
      }
    } else {
      const nodes = trees.get(r.key)!;
      (leaf as ExpressionStep).outputs.forEach((o, k) => scope.set(o.symbol, evaluateDual(nodes[k], scope, n)));
    }
  }
  const outputs: Record<string, PropagatedOutput> = {};
  for (const o of def.outputs) {
    const y = scope.get(o.symbol)!;
    const unit = chain.units.get(o.symbol) ?? '1';
    const budget: BudgetLine[] = sources.map((s, k) => {
      const sensitivity = y.v === 0 ? 0 : y.d[nIn + k] / y.v;
      const contribution = s.band ? Math.abs(sensitivity) * s.band.rel : null;
      return { step: s.step, title: s.title, symbol: s.symbol, correlation: s.correlation, rel: s.band?.rel ?? null, basis: s.band?.basis ?? null, sensitivity, contribution, share: null };
    }).filter((l) => Math.abs(l.sensitivity) > 1e-12);
    const sum = budget.reduce((acc, l) => acc + (l.contribution ?? 0) ** 2, 0);
    for (const l of budget) l.share = l.contribution === null ? null : sum > 0 ? l.contribution ** 2 / sum : 0;
    budget.sort((a, b) => (b.contribution ?? Infinity) - (a.contribution ?? Infinity));
    const sensitivities = Object.fromEntries(chain.inputSymbols.map((s, i) => {
      const derivative = y.d[i];
      return [s, { derivative, elasticity: y.v === 0 ? 0 : (derivative * values[i]) / y.v, unit: `${unit} per ${chain.units.get(s)}` }];
    }));
    outputs[o.symbol] = { value: y.v, unit, rel: budget.some((l) => l.contribution !== null) ? Math.sqrt(sum) : null, complete: budget.every((l) => l.rel !== null), budget, sensitivities };
  }
  return { method: PROPAGATION_METHOD, outputs };
}
