import { compiled, EvaluationError } from './compile';
import type { Definition } from './types';
import { boundsOf, isLogRange } from './ranges';

export interface CompareSeries {
  label: string;
  points: { x: number; y: number | null; warned: boolean }[];
  /** The part of the sweep inside this definition's own validity range for the swept input. */
  validFrom?: number;
  validTo?: number;
}

export interface Comparison {
  sweep: string;
  output: string;
  scale: 'log' | 'linear';
  from: number;
  to: number;
  series: CompareSeries[];
  /** Largest relative difference of each series from the first where both are valid, and where it occurs. */
  largest: { label: string; relDiff: number; at: number }[];
  /** How each series differs from the first, in words' terms (where both are valid). */
  differences: Difference[];
}

/**
 * The signed relative difference (s − base)/|base| over the points where both are valid, summarised: none (below the
 * evaluation's rounding, ROUNDING), uniform (the same everywhere to UNIFORM, e.g. a changed leading coefficient),
 * or varying between min and max. `points` counts where both were valid.
 */
export interface Difference {
  label: string;
  kind: 'none' | 'uniform' | 'varies' | 'no-overlap';
  /** Signed relative differences: the uniform value, or the range. */
  value?: number;
  min?: number;
  max?: number;
  points: number;
}

/** Relative differences below this are the evaluation's rounding (a few ulps through a chain of operations). */
export const ROUNDING = 1e-9;
/** A difference whose spread across the range is below this (relative) is the same everywhere. */
export const UNIFORM = 1e-6;

export function describeDifference(base: CompareSeries, s: CompareSeries): Difference {
  const d: number[] = [];
  s.points.forEach((p, i) => {
    const b = base.points[i];
    if (p.y === null || b.y === null || b.y === 0 || p.warned || b.warned) return;
    const r = (p.y - b.y) / Math.abs(b.y);
    d.push(Math.abs(r) < ROUNDING ? 0 : r);
  });
  if (!d.length) return { label: s.label, kind: 'no-overlap', points: 0 };
  const min = Math.min(...d);
  const max = Math.max(...d);
  if (Math.max(Math.abs(min), Math.abs(max)) === 0) return { label: s.label, kind: 'none', points: d.length };
  if (max - min <= UNIFORM * Math.max(1, Math.abs((max + min) / 2))) return { label: s.label, kind: 'uniform', value: (max + min) / 2, points: d.length };
  return { label: s.label, kind: 'varies', min, max, points: d.length };
}

/** Log spacing for inputs spanning two decades or more (Re, Ra…), linear otherwise. */
export function grid(from: number, to: number, points: number): { xs: number[]; scale: 'log' | 'linear' } {
  const log = isLogRange(from, to);
  const xs = Array.from({ length: points }, (_, i) => {
    const t = points === 1 ? 0 : i / (points - 1);
    return log ? Math.exp(Math.log(from) + t * (Math.log(to) - Math.log(from))) : from + t * (to - from);
  });
  return { xs, scale: log ? 'log' : 'linear' };
}

/**
 * Evaluates several definitions with compatible inputs over a grid of one input (the others held
 * fixed). The default range is the overlap of their validity ranges for that input.
 */
export function compareDefinitions({ items, sweep, output, fixed, from, to, points = 80 }: {
  items: { label: string; definition: Definition }[];
  sweep: string;
  output: string;
  fixed: Record<string, number>;
  from?: number;
  to?: number;
  points?: number;
}): Comparison {
  if (items.length === 0) throw new Error('nothing to compare');
  for (const it of items) {
    if (!it.definition.inputs.some((i) => i.symbol === sweep)) throw new Error(`${it.label} has no input "${sweep}"`);
    if (!it.definition.outputs.some((o) => o.symbol === output)) throw new Error(`${it.label} has no output "${output}"`);
  }
  const ranges = items.map((it) => boundsOf(it.definition, sweep));
  const lo = from ?? Math.max(...ranges.map((r) => r.min ?? -Infinity));
  const hi = to ?? Math.min(...ranges.map((r) => r.max ?? Infinity));
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) {
    throw new Error(`no validity range bounds ${sweep} on ${!Number.isFinite(lo) ? 'the low' : 'the high'} side; give an explicit range`);
  }
  if (!(lo < hi)) throw new Error(`the validity ranges of ${sweep} do not overlap; give an explicit range`);
  const { xs, scale } = grid(lo, hi, Math.max(2, Math.min(points, 2000)));
  const series: CompareSeries[] = items.map((it, k) => {
    const c = compiled(it.definition);
    const points = xs.map((x) => {
      const row = new Float64Array(c.inputSymbols.length);
      c.inputSymbols.forEach((s, i) => { row[i] = s === sweep ? x : fixed[s] ?? NaN; });
      const missing = c.inputSymbols.filter((s) => s !== sweep && fixed[s] === undefined);
      if (missing.length) throw new Error(`give a value for ${missing.join(', ')} (held fixed during the sweep)`);
      try {
        const r = c.run(row);
        return { x, y: r.outputs[output], warned: r.warnings.length > 0 };
      } catch (err) {
        if (err instanceof EvaluationError) return { x, y: null, warned: true };
        throw err;
      }
    });
    return { label: it.label, points, validFrom: ranges[k].min, validTo: ranges[k].max };
  });
  const base = series[0];
  // Differences count only where both curves are inside their validity ranges (no warning, a result): comparing
  // an extrapolation says nothing about either correlation.
  const largest = series.slice(1).map((s) => {
    let best = { relDiff: 0, at: xs[0] };
    s.points.forEach((p, i) => {
      const b = base.points[i];
      if (p.y === null || b.y === null || b.y === 0 || p.warned || b.warned) return;
      const d = Math.abs(p.y - b.y) / Math.abs(b.y);
      if (d > best.relDiff) best = { relDiff: d, at: p.x };
    });
    return { label: s.label, ...best };
  });
  const differences = series.slice(1).map((s) => describeDifference(base, s));
  return { sweep, output, scale, from: lo, to: hi, series, largest, differences };
}
