import type { Definition } from './types';

/** The declared bounds of a symbol (first min and first max among its limits). Free of mathjs. */
export function boundsOf(def: Pick<Definition, 'validity'>, symbol: string): { min?: number; max?: number } {
  const lims = (def.validity ?? []).filter((l) => l.symbol === symbol);
  return { min: lims.find((l) => l.min !== undefined)?.min, max: lims.find((l) => l.max !== undefined)?.max };
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
