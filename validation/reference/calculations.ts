/**
 * Hand calculations of the seeded calculation templates, written out step by step in plain
 * TypeScript from the published correlations and the governed property tables — not through
 * Correlary's engine or the template files. They check a template's wiring (which value feeds which
 * step, unit conversions, the regime rule), not the correlations themselves, which carry their own
 * evidence. A template check case (kind "transcription": it checks wiring) names its key here
 * ("validation/reference/calculations.ts#<key>"); validation/library.test.ts recomputes it.
 */
import { readLibrary, readPropertyTables } from '@/lib/governance/library';

type Row = Record<string, number>;

/** Linear interpolation in a governed property table, by key column: the version the templates pin (2 when generated). */
export function tableAt(slug: string, at: number): Row {
  const entry = readPropertyTables().find((e) => e.slug === slug) ?? readLibrary().find((e) => e.slug === slug);
  const table = (entry?.definition as { tables?: { key: string; columns: { name: string; values: number[] }[] }[] })?.tables?.[0];
  if (!table) throw new Error(`no table in ${slug}`);
  const key = table.columns.find((c) => c.name === table.key)!.values;
  let i = 0;
  while (i < key.length - 2 && at > key[i + 1]) i++;
  const t = (at - key[i]) / (key[i + 1] - key[i]);
  return Object.fromEntries(table.columns.map((c) => [c.name, c.values[i] + t * (c.values[i + 1] - c.values[i])]));
}

const P_ATM = 101325; // Pa, one standard atmosphere (exact by definition)
const G = 9.80665; // m/s², standard acceleration of gravity (exact by definition, CGPM 1901)

/**
 * Flat plate in air: T_f = (T_s + T_inf)/2; air at T_f from the 1 atm table; ν, α scaled by
 * p_atm/p (ideal gas); Re_L = u L/ν; Nu_L = 0.664 Re_L^½ Pr^⅓ (Pohlhausen 1921) for Re_L ≤ 5×10^5,
 * else (0.037 Re_L^⅘ − 871) Pr^⅓ (mixed layer, Re_x,c = 5×10^5: Incropera et al. 2007, eq. 7.38);
 * h = Nu k/L; q = h L W (T_s − T_inf); δ = 4.91 L/√Re_L (Blasius 1908, 99 % thickness) or
 * 0.37 L Re_L^(−1/5) (1/7-power law, Schlichting & Gersten 2000, ch. 21).
 */
export function flatPlateAir({ T_inf, T_s, p, u_inf, L, W }: Row): Row {
  const T_f = (T_s + T_inf) / 2;
  const air = tableAt('air-properties-1atm', T_f);
  const nu = air.nu * (P_ATM / p);
  const Re_L = (u_inf * L) / nu;
  const laminar = Re_L <= 5e5;
  const Nu_L = laminar ? 0.664 * Math.sqrt(Re_L) * Math.cbrt(air.Pr) : (0.037 * Re_L ** 0.8 - 871) * Math.cbrt(air.Pr);
  const h = (Nu_L * air.k) / L;
  const q = h * L * W * (T_s - T_inf);
  const delta_L = laminar ? (4.91 * L) / Math.sqrt(Re_L) : 0.37 * L * Re_L ** -0.2;
  return { T_f, Re_L, Pr: air.Pr, Nu_L, h, q, delta_L, nu, k: air.k };
}

/**
 * Vertical isothermal plate in air, free convection: T_f, air at T_f (ν, α scaled to p), β = 1/T_f
 * (ideal gas), Ra_H = g β |T_s − T_inf| H³/(ν α), Churchill & Chu (1975) eq. for all Ra:
 * Nu = {0.825 + 0.387 Ra^(1/6) / [1 + (0.492/Pr)^(9/16)]^(8/27)}², h = Nu k/H, q = h H W (T_s − T_inf).
 */
export function verticalPlateAir({ T_inf, T_s, p, H, W }: Row): Row {
  const T_f = (T_s + T_inf) / 2;
  const air = tableAt('air-properties-1atm', T_f);
  const nu = air.nu * (P_ATM / p);
  const alpha = air.alpha * (P_ATM / p);
  const Ra_H = (G * (1 / T_f) * Math.abs(T_s - T_inf) * H ** 3) / (nu * alpha);
  const Nu_H = (0.825 + (0.387 * Ra_H ** (1 / 6)) / (1 + (0.492 / air.Pr) ** (9 / 16)) ** (8 / 27)) ** 2;
  const h = (Nu_H * air.k) / H;
  return { T_f, Ra_H, Pr: air.Pr, Nu_H, h, q: h * H * W * (T_s - T_inf) };
}

/**
 * Water heated in a tube with uniform wall heat flux, from inlet and outlet temperatures: bulk
 * mean T_m = (T_in + T_out)/2, saturated water at T_m, Re_D = 4 ṁ/(π D μ), Nu_D = 48/11 (laminar,
 * fully developed, uniform flux: Shah & London 1978) for Re_D ≤ 2300, else Gnielinski (1976) with the
 * Petukhov friction factor; h = Nu k/D, q = ṁ c_p (T_out − T_in), q_s = q/(π D L),
 * T_s,out = T_out + q_s/h (wall temperature at the outlet, fully developed).
 */
export function tubeWaterHeating({ m_dot, D, L, T_in, T_out }: Row): Row {
  const T_m = (T_in + T_out) / 2;
  const w = tableAt('water-saturated-properties', T_m);
  const Re_D = (4 * m_dot) / (Math.PI * D * w.mu);
  let Nu_D: number;
  if (Re_D <= 2300) Nu_D = 48 / 11;
  else {
    const f = (0.79 * Math.log(Re_D) - 1.64) ** -2;
    Nu_D = ((f / 8) * (Re_D - 1000) * w.Pr) / (1 + 12.7 * Math.sqrt(f / 8) * (w.Pr ** (2 / 3) - 1));
  }
  const h = (Nu_D * w.k) / D;
  const q = m_dot * w.cp * (T_out - T_in);
  const q_s = q / (Math.PI * D * L);
  return { T_m, Re_D, Pr: w.Pr, Nu_D, h, q, q_s, T_s_out: T_out + q_s / h };
}

export const CALCULATIONS: Record<string, (inputs: Row) => Row> = { flatPlateAir, verticalPlateAir, tubeWaterHeating };
