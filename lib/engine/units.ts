import { unit as mathUnit, type Unit } from 'mathjs';

/** "1", "", "-" and "dimensionless" all mean a pure number. */
export function isDimensionless(u: string): boolean {
  return ['1', '', '-', 'dimensionless'].includes(u.trim());
}

/** Offset scales (°C, °F) are fine for callers but not as declared units inside formulas. */
export function isOffsetUnit(u: string): boolean {
  return /^\s*(degC|degF|celsius|fahrenheit)\s*$/.test(u);
}

/** Parses a unit string; throws an Error with a readable message when mathjs does not know it. */
export function parseUnit(u: string): Unit {
  try {
    return mathUnit(u);
  } catch {
    throw new Error(`"${u}" is not a unit Correlary knows (use SI names such as m, s, K, Pa, W/(m^2 K), or 1 for dimensionless)`);
  }
}

const affineCache = new Map<string, { a: number; b: number }>();

/**
 * Converts `value` from unit `from` to unit `to`. Unit conversions are affine (offset scales such as
 * degC included), so the factor and offset are computed once per pair and cached.
 */
export function convert(value: number, from: string, to: string): number {
  if (from === to) return value;
  const key = `${from}\u0000${to}`;
  let c = affineCache.get(key);
  if (!c) {
    if (isDimensionless(to)) {
      if (isDimensionless(from)) return value;
      throw new Error(`a dimensionless value cannot be given in "${from}"`);
    }
    const target = parseUnit(to);
    const source = isDimensionless(from) ? null : parseUnit(from);
    if (!source || !source.equalBase(target)) {
      throw new Error(`"${from}" cannot be converted to "${to}" (different dimensions)`);
    }
    const at = (x: number) => mathUnit(x, from).toNumber(to);
    const b = at(0);
    c = { a: at(1) - b, b };
    if (affineCache.size > 500) affineCache.clear();
    affineCache.set(key, c);
  }
  return c.a * value + c.b;
}

/** A mathjs quantity for dimension checks: plain number for dimensionless. */
export function quantity(value: number, u: string): number | Unit {
  return isDimensionless(u) ? value : mathUnit(value, u);
}

/** The dimension of a value as text, for messages ("W / m^2"). */
export function describeDimension(v: unknown): string {
  if (typeof v === 'number') return 'dimensionless (1)';
  if (v && typeof v === 'object' && 'formatUnits' in v) {
    const u = v as Unit;
    if (u.dimensions.every((d) => d === 0)) return 'dimensionless (1)';
    return u.toSI().formatUnits() || 'dimensionless (1)';
  }
  return typeof v;
}

/** True when `v` (number or Unit) has the dimension of unit string `u`. */
export function hasDimensionOf(v: unknown, u: string): boolean {
  if (typeof v === 'number') return isDimensionless(u);
  if (v && typeof v === 'object' && 'equalBase' in v) {
    const q = v as Unit;
    if (isDimensionless(u)) return q.dimensions.every((d) => d === 0);
    return q.equalBase(parseUnit(u));
  }
  return false;
}
