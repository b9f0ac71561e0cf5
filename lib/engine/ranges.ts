import type { Definition } from './types';

/** The declared bounds of a symbol: the largest minimum and the smallest maximum among its limits. Free of mathjs. */
export function boundsOf(def: Pick<Definition, 'validity'>, symbol: string): { min?: number; max?: number } {
  return boundsAmong(def.validity ?? [], symbol);
}

/**
 * The same over any list of limits (declared or compiled). Several rules on one symbol (a published range and a
 * narrower one the evidence supports) give the box where none warns.
 */
export function boundsAmong(limits: readonly { symbol: string; min?: number; max?: number }[], symbol: string): { min?: number; max?: number } {
  const lims = limits.filter((l) => l.symbol === symbol);
  const mins = lims.map((l) => l.min).filter((v): v is number => v !== undefined);
  const maxes = lims.map((l) => l.max).filter((v): v is number => v !== undefined);
  return { min: mins.length ? Math.max(...mins) : undefined, max: maxes.length ? Math.min(...maxes) : undefined };
}

/** True when a range is wide enough (two decades) to be read on a logarithmic scale. */
export function isLogRange(min: number, max: number): boolean {
  return min > 0 && max / min >= 100;
}

/** A representative value of an input: the (geometric, when wide) middle of its range, else 1. */
export function typicalValue(def: Pick<Definition, 'validity'>, symbol: string): number {
  const { min, max } = boundsOf(def, symbol);
  if (min !== undefined && max !== undefined) return isLogRange(min, max) ? Math.sqrt(min * max) : (min + max) / 2;
  if (min !== undefined) return min > 0 ? min * 10 : min + 1;
  if (max !== undefined) return max > 0 ? max / 10 : max - 1;
  return 1;
}
