/**
 * Independent solutions of turbulent wall flows, computed here from models of the turbulence itself
 * and not from any correlation in the library:
 *
 * 1. Fully developed pipe flow by the mixing-length model: Nikuradse's mixing length for pipes
 *    (l/R = 0.14 − 0.08(1 − y/R)² − 0.06(1 − y/R)⁴) with van Driest's (1956) wall damping
 *    1 − exp(−y⁺/26), κ = 0.41; the momentum balance τ/τ_w = 1 − y/R integrated from the wall, the
 *    energy equation for a uniform wall heat flux with Kays' (1994) turbulent Prandtl number
 *    Pr_t = 0.85 + 0.7/Pe_t. Gives the Darcy friction factor and the Nusselt number at any Re_D, Pr.
 *    The model's own uncertainty (about 5 % in f and 10 % in Nu for 0.7 ≤ Pr ≤ 10, from memory of
 *    Kays, Crawford & Weigand, Convective Heat and Mass Transfer, 4th ed. 2005, ch. 11–13) is part
 *    of every tolerance that uses it; its van Driest damping is not meant for Pr ≫ 10.
 *
 * 2. The zero-pressure-gradient turbulent boundary layer by the momentum integral dθ/dx = C_f/2, with
 *    C_f taken at each Re_θ from the law of the wall and wake: Reichardt's (1951) inner law
 *    (κ = 0.41, intercept B = 5.0) plus Coles' (1956) wake 2Π sin²(πy/2δ)/κ with the Cebeci & Smith (1974) Π(Re_θ).
 *    Heat transfer from the Kármán-type analogy St = (C_f/2)/(Pr_t (1 + √(C_f/2) P)) with the
 *    Jayatilleke (1969) sublayer resistance P(Pr) and Pr_t = 0.85. Layer turbulent from x = 0.
 *    Model uncertainty about 5 % in C_f and 10 % in Nu (from memory, same source).
 */

const KAPPA = 0.41;
const A_PLUS = 26;

interface PipeSolution { re: number; f: number; nu: (pr: number) => number }

/** One pipe solution at a friction Reynolds number R⁺ = u_τ R/ν. */
function pipeAt(rPlus: number, n = 2400) {
  // y⁺ = expm1(s ln(1 + R⁺)) clusters points at the wall (first step ≈ 0.005 wall units).
  const span = Math.log1p(rPlus);
  const y = Array.from({ length: n + 1 }, (_, i) => Math.expm1((i / n) * span));
  y[n] = rPlus;
  const lPlus = (yp: number) => {
    const w = 1 - yp / rPlus;
    return rPlus * (0.14 - 0.08 * w * w - 0.06 * w ** 4) * (1 - Math.exp(-yp / A_PLUS));
  };
  const dudy = y.map((yp) => {
    const tau = 1 - yp / rPlus;
    const l = lPlus(yp);
    return (2 * tau) / (1 + Math.sqrt(1 + 4 * l * l * tau));
  });
  const nut = y.map((yp, i) => lPlus(yp) ** 2 * dudy[i]);
  const u = [0];
  for (let i = 1; i <= n; i++) u.push(u[i - 1] + 0.5 * (dudy[i] + dudy[i - 1]) * (y[i] - y[i - 1]));
  // ∫ g dy on the grid (trapezoid).
  const integral = (g: (i: number) => number) => {
    let s = 0;
    for (let i = 1; i <= n; i++) s += 0.5 * (g(i) + g(i - 1)) * (y[i] - y[i - 1]);
    return s;
  };
  const flow = integral((i) => u[i] * (rPlus - y[i]));
  const um = (2 / rPlus ** 2) * flow;
  // G(y) = ∫ from y to the axis of u r dr: the heat carried inside radius r.
  const g = new Array<number>(n + 1).fill(0);
  for (let i = n - 1; i >= 0; i--) g[i] = g[i + 1] + 0.5 * (u[i] * (rPlus - y[i]) + u[i + 1] * (rPlus - y[i + 1])) * (y[i + 1] - y[i]);
  const nu = (pr: number) => {
    const t = [0];
    const slope = (i: number) => {
      const r = rPlus - y[i];
      const q = r > 0 ? (rPlus / r) * (g[i] / g[0]) : 0;
      const pet = nut[i] * pr;
      const prt = 0.85 + (pet > 0 ? 0.7 / pet : Infinity);
      return q / (1 / pr + nut[i] / prt);
    };
    let prev = slope(0);
    for (let i = 1; i <= n; i++) { const s = slope(i); t.push(t[i - 1] + 0.5 * (s + prev) * (y[i] - y[i - 1])); prev = s; }
    const tm = integral((i) => u[i] * t[i] * (rPlus - y[i])) / flow;
    return (2 * rPlus * pr) / tm;
  };
  return { re: 2 * rPlus * um, f: 8 / (um * um), nu };
}

const pipeCache = new Map<number, PipeSolution>();

/** Fully developed turbulent pipe flow at Re_D (smooth wall): R⁺ found by fixed-point iteration on Re_D ∝ R⁺^(8/7). */
export function mixingLengthPipe(re: number): PipeSolution {
  const hit = pipeCache.get(re);
  if (hit) return hit;
  let rPlus = 0.1 * re ** 0.875;
  let solution = pipeAt(rPlus);
  for (let i = 0; i < 60 && Math.abs(solution.re / re - 1) > 1e-12; i++) {
    rPlus *= (re / solution.re) ** 0.875;
    solution = pipeAt(rPlus);
  }
  if (Math.abs(solution.re / re - 1) > 1e-9) throw new Error(`mixing-length pipe: no convergence at Re_D = ${re}`);
  if (pipeCache.size > 500) pipeCache.clear();
  pipeCache.set(re, solution);
  return solution;
}

// ——— the flat-plate boundary layer ———

// Reichardt's constant 7.8 set to 7.175 so that the log law's intercept is B = 5.0 with κ = 0.41 (Coles 1956).
const C_REICHARDT = 5.0 - Math.log(KAPPA) / KAPPA;
const inner = (yp: number) => Math.log1p(KAPPA * yp) / KAPPA + C_REICHARDT * (1 - Math.exp(-yp / 11) - (yp / 11) * Math.exp(-yp / 3));
/** Cebeci & Smith (1974) wake strength against Re_θ (0 below Re_θ = 425). */
const wakeStrength = (reTheta: number) => {
  const z = reTheta / 425 - 1;
  return z > 0 ? 0.55 * (1 - Math.exp(-0.243 * Math.sqrt(z) - 0.298 * z)) : 0;
};

interface LayerState { dPlus: number; uInf: number; reTheta: number; reDelta: number; reX: number }

function layerAt(dPlus: number, pi: number) {
  const n = 1200;
  const span = Math.log1p(dPlus);
  const profile = (yp: number) => inner(yp) + ((2 * pi) / KAPPA) * Math.sin((Math.PI * yp) / (2 * dPlus)) ** 2;
  const uInf = profile(dPlus);
  let theta = 0;
  let prevY = 0;
  let prevG = 0;
  for (let i = 1; i <= n; i++) {
    const yp = i === n ? dPlus : Math.expm1((i / n) * span);
    const r = profile(yp) / uInf;
    const g = r * (1 - r);
    theta += 0.5 * (g + prevG) * (yp - prevY);
    prevY = yp; prevG = g;
  }
  return { uInf, reTheta: theta * uInf, reDelta: dPlus * uInf };
}

let layerTable: LayerState[] | undefined;

/** Marches the momentum integral dRe_x = U⁺² dRe_θ over δ⁺ from 30 to 2×10⁶ (Π iterated with Re_θ). */
function layer(): LayerState[] {
  if (layerTable) return layerTable;
  const rows: LayerState[] = [];
  const steps = 1500;
  for (let i = 0; i <= steps; i++) {
    const dPlus = 30 * Math.exp((i / steps) * Math.log(2e6 / 30));
    let pi = 0;
    let s = layerAt(dPlus, pi);
    for (let k = 0; k < 20; k++) { pi = wakeStrength(s.reTheta); s = layerAt(dPlus, pi); }
    const prev = rows[i - 1];
    // Below δ⁺ = 30 the layer is thin and nearly laminar: its origin is estimated as U⁺² Re_θ (≈ 1 % of Re_x at 5e5).
    const reX = prev ? prev.reX + 0.5 * (s.uInf ** 2 + prev.uInf ** 2) * (s.reTheta - prev.reTheta) : s.uInf ** 2 * s.reTheta;
    rows.push({ dPlus, ...s, reX });
  }
  layerTable = rows;
  return rows;
}

/** The layer's state at Re_x (log-linear interpolation in the marched table). */
export function turbulentLayer(reX: number): { cf: number; deltaOverX: number; thetaOverX: number } {
  const rows = layer();
  if (!(reX >= rows[0].reX && reX <= rows[rows.length - 1].reX)) throw new RangeError(`Re_x = ${reX} outside the marched layer`);
  // Binary search for the first row at or past Re_x.
  let lo = 1;
  let hi = rows.length - 1;
  while (lo < hi) { const mid = (lo + hi) >> 1; if (rows[mid].reX >= reX) hi = mid; else lo = mid + 1; }
  const k = lo;
  const a = rows[k - 1];
  const b = rows[k];
  const w = Math.log(reX / a.reX) / Math.log(b.reX / a.reX);
  const mix = (p: number, q: number) => Math.exp(Math.log(p) + w * (Math.log(q) - Math.log(p)));
  const uInf = mix(a.uInf, b.uInf);
  return { cf: 2 / uInf ** 2, deltaOverX: mix(a.reDelta, b.reDelta) / reX, thetaOverX: mix(a.reTheta, b.reTheta) / reX };
}

/** Jayatilleke (1969) sublayer resistance with Pr_t = 0.85. */
const sublayer = (pr: number) => 9.24 * ((pr / 0.85) ** 0.75 - 1) * (1 + 0.28 * Math.exp((-0.007 * pr) / 0.85));

/** Local Nusselt number of the turbulent layer from the Kármán-type analogy. */
export function turbulentLayerNusselt(reX: number, pr: number): number {
  const { cf } = turbulentLayer(reX);
  const st = cf / 2 / (0.85 * (1 + Math.sqrt(cf / 2) * sublayer(pr)));
  return st * reX * pr;
}
