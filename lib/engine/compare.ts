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
  /** Largest relative difference of each series from the first, and where it occurs. */
  largest: { label: string; relDiff: number; at: number }[];
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
  if (!Number.isFinite(lo) || !Number.isFinite(hi) || !(lo < hi)) {
    throw new Error(`the validity ranges of ${sweep} do not overlap; give an explicit range`);
  }
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
  const largest = series.slice(1).map((s) => {
    let best = { relDiff: 0, at: xs[0] };
    s.points.forEach((p, i) => {
      const b = base.points[i].y;
      if (p.y === null || b === null || b === 0) return;
      const d = Math.abs(p.y - b) / Math.abs(b);
      if (d > best.relDiff) best = { relDiff: d, at: p.x };
    });
    return { label: s.label, ...best };
  });
  return { sweep, output, scale, from: lo, to: hi, series, largest };
}
