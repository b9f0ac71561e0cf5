/**
 * Laminar fully developed flow and heat transfer in non-circular ducts, solved here independently of
 * the fitted polynomials and tabulated values in the library.
 *
 * Rectangular duct, half-sides a ≤ b, aspect α = a/b:
 * - friction: the exact series solution of the Poisson equation ∇²u = −G/μ (Boussinesq 1868; White,
 *   Viscous Fluid Flow, eq. 3-48): Q = (4ba³/3)(G/μ)[1 − (192a/(π⁵b)) Σ_{i odd} tanh(iπb/2a)/i⁵];
 *   with u_m = Q/(4ab) and D_h = 4ab/(a + b), the Darcy f·Re = 2 D_h² (G/μ)/u_m;
 * - H1 heat transfer (axially uniform flux, peripherally uniform wall temperature): ∇²θ = u/u_m on a
 *   cell-centred finite-difference grid of the quarter section (symmetry on the centre lines, θ = 0 on
 *   the walls), Nu_H1 = D_h²/(4 |θ_b|) with θ_b the mixed-mean;
 * - T heat transfer (uniform wall temperature): the least eigenvalue of ∇²θ + λ (u/u_m) θ = 0 by inverse
 *   iteration, Nu_T = λ D_h²/4.
 * The grid results at h and h/2 are extrapolated (Richardson, second order), leaving about 1e-5; the
 * Poisson problems are solved directly (a cosine transform across the short side, tridiagonal along the long).
 *
 * Parallel plates and concentric annuli reduce to one dimension and are solved the same way on a fine
 * grid (second order, extrapolated).
 */

/** Darcy f·Re on D_h for a rectangular duct of aspect α = short/long side (0 < α ≤ 1), by the series. */
export function rectangularDuctFrictionSeries(alpha: number): number {
  const a = alpha; // short half-side, with b = 1
  const b = 1;
  let sum = 0;
  for (let i = 1; i < 400; i += 2) sum += Math.tanh((i * Math.PI * b) / (2 * a)) / i ** 5;
  const q = ((4 * b * a ** 3) / 3) * (1 - ((192 * a) / (Math.PI ** 5 * b)) * sum);
  const um = q / (4 * a * b);
  const dh = (4 * a * b) / (a + b);
  return (2 * dh * dh) / um;
}

/**
 * Direct Poisson solver on the quarter section [0,a]×[0,b], cell-centred, ∇²φ = s, symmetry at x = 0 and
 * y = 0, φ = 0 at x = a and y = b. The discrete x-operator has the exact eigenvectors
 * cos((k+½)π(i+½)/n) (a type-IV cosine transform); each mode leaves a tridiagonal system in y.
 */
function poissonQuarter(nx: number, ny: number, a: number, b: number, source: Float64Array): Float64Array {
  const hx = a / nx;
  const hy = b / ny;
  const basis = new Float64Array(nx * nx);
  for (let k = 0; k < nx; k++) for (let i = 0; i < nx; i++) basis[k * nx + i] = Math.cos(((k + 0.5) * Math.PI * (i + 0.5)) / nx);
  const phi = new Float64Array(nx * ny);
  const lo = new Float64Array(ny); const di = new Float64Array(ny); const up = new Float64Array(ny); const rhs = new Float64Array(ny);
  const cy = 1 / (hy * hy);
  for (let k = 0; k < nx; k++) {
    const mu = (-4 / (hx * hx)) * Math.sin(((k + 0.5) * Math.PI) / (2 * nx)) ** 2;
    for (let j = 0; j < ny; j++) {
      let sk = 0;
      for (let i = 0; i < nx; i++) sk += basis[k * nx + i] * source[j * nx + i];
      rhs[j] = (2 / nx) * sk;
      lo[j] = j === 0 ? 0 : cy;
      up[j] = j === ny - 1 ? 0 : cy;
      di[j] = mu - 2 * cy + (j === 0 ? cy : 0) - (j === ny - 1 ? cy : 0);
    }
    const psi = thomas(lo, di, up, rhs);
    for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) phi[j * nx + i] += basis[k * nx + i] * psi[j];
  }
  return phi;
}

function rectangularGrid(alpha: number, n: number) {
  const a = alpha;
  const b = 1;
  const nx = n;
  const ny = Math.max(n, Math.round(n / alpha));
  const area = a * b; // quarter
  const dh = (4 * a * b) / (a + b);
  const u = poissonQuarter(nx, ny, a, b, new Float64Array(nx * ny).fill(-1));
  const um = u.reduce((s, v) => s + v, 0) / (nx * ny);
  const w = Float64Array.from(u, (v) => v / um);
  // H1: ∇²θ = u/u_m.
  const th = poissonQuarter(nx, ny, a, b, w);
  const thetaB = th.reduce((s, v, k) => s + v * w[k], 0) / (nx * ny);
  const nuH1 = (dh * dh) / (4 * Math.abs(thetaB));
  // T: inverse iteration on ∇²θ = −λ w θ.
  let phi = new Float64Array(nx * ny).fill(1);
  let lambda = 0;
  for (let it = 0; it < 200; it++) {
    const rhs = Float64Array.from(phi, (v, k) => -w[k] * v);
    const next = poissonQuarter(nx, ny, a, b, rhs);
    // Rayleigh quotient with the weight w: λ ≈ Σ w φ·φ / Σ w φ·next
    let num = 0; let den = 0;
    for (let k = 0; k < phi.length; k++) { num += w[k] * phi[k] * phi[k]; den += w[k] * phi[k] * next[k]; }
    const est = num / den;
    const norm = Math.sqrt(next.reduce((s, v) => s + v * v, 0));
    phi = Float64Array.from(next, (v) => v / norm);
    if (Math.abs(est - lambda) < 1e-12 * est) { lambda = est; break; }
    lambda = est;
  }
  void area;
  return { fRe: (2 * dh * dh) / ((u.reduce((s, v) => s + v, 0) / (nx * ny))), nuH1, nuT: (lambda * dh * dh) / 4 };
}

const rectCache = new Map<number, { fRe: number; nuH1: number; nuT: number }>();
/** Rectangular duct by finite differences, Richardson-extrapolated from n and 2n cells across the short half-side. */
export function rectangularDuctFd(alpha: number, n = 24): { fRe: number; nuH1: number; nuT: number } {
  const hit = rectCache.get(alpha);
  if (hit) return hit;
  const c = rectangularGrid(alpha, n);
  const f = rectangularGrid(alpha, 2 * n);
  const ex = (x: number, y: number) => (4 * y - x) / 3;
  const r = { fRe: ex(c.fRe, f.fRe), nuH1: ex(c.nuH1, f.nuH1), nuT: ex(c.nuT, f.nuT) };
  rectCache.set(alpha, r);
  return r;
}

/** Tridiagonal solve (Thomas). */
function thomas(a: Float64Array, b: Float64Array, c: Float64Array, d: Float64Array): Float64Array<ArrayBuffer> {
  const n = b.length;
  const bb = Float64Array.from(b); const dd = Float64Array.from(d);
  for (let i = 1; i < n; i++) { const m = a[i] / bb[i - 1]; bb[i] -= m * c[i - 1]; dd[i] -= m * dd[i - 1]; }
  const x = new Float64Array(n);
  x[n - 1] = dd[n - 1] / bb[n - 1];
  for (let i = n - 2; i >= 0; i--) x[i] = (dd[i] - c[i] * x[i + 1]) / bb[i];
  return x;
}

/**
 * One-dimensional channel between walls at y = 0 and y = 1 (cell-centred), ∇²φ = s with a wall at each
 * end either fixed (φ = 0) or insulated (φ′ = 0). Returns the cell values.
 */
function channel(n: number, s: Float64Array, lower: 'fixed' | 'insulated', upper: 'fixed' | 'insulated', r?: (y: number) => number): Float64Array {
  // With r (annulus: y is the radius): (1/r)(r φ′)′ = s.
  const h = 1 / n;
  const a = new Float64Array(n); const b = new Float64Array(n); const c = new Float64Array(n); const d = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const y = (i + 0.5) * h;
    const rw = r ? r(y - h / 2) : 1; const re = r ? r(y + h / 2) : 1; const rc = r ? r(y) : 1;
    const w = rw / (rc * h * h); const e = re / (rc * h * h);
    let diag = -w - e;
    if (i === 0) { a[i] = 0; diag += lower === 'fixed' ? -w : w; } else a[i] = w;
    if (i === n - 1) { c[i] = 0; diag += upper === 'fixed' ? -e : e; } else c[i] = e;
    b[i] = diag;
    d[i] = s[i];
  }
  return thomas(a, b, c, d);
}

/**
 * Parallel plates (gap 2a, D_h = 4a), both walls or one wall heated: f·Re, Nu_H (uniform flux) and Nu_T
 * (uniform temperature, by inverse iteration), finite differences extrapolated from n and 2n cells.
 */
const platesCache = new Map<string, { fRe: number; nuH: number; nuT: number }>();
export function parallelPlatesFd(heated: 'both' | 'one', n = 400): { fRe: number; nuH: number; nuT: number } {
  const key = `${heated}:${n}`;
  const hit = platesCache.get(key);
  if (hit) return hit;
  const solve = (m: number) => {
    // The whole gap 0…1 (so D_h = 2 in these units); walls at both ends for the flow.
    const u = channel(m, new Float64Array(m).fill(-1), 'fixed', 'fixed');
    const um = u.reduce((s, v) => s + v, 0) / m;
    const w = Float64Array.from(u, (v) => v / um);
    const dh = 2;
    const lower = 'fixed' as const;
    const upper = heated === 'both' ? ('fixed' as const) : ('insulated' as const);
    // Uniform flux on the heated wall(s): θ = T − T_w with the heated wall(s) at θ = 0 is the H problem only when the
    // wall temperature is uniform around the heated perimeter — true for plates. Energy: ∇²θ = w · (q P/(k A)) scale.
    const th = channel(m, w, lower, upper);
    const thetaB = th.reduce((s, v, k) => s + v * w[k], 0) / m;
    // With ∇²θ = w, the flux into the fluid per unit heated width is A/P_h (A = 1, P_h = 1 or 2 walls): Nu = (A/P_h) D_h/|θ_b|.
    const ph = heated === 'both' ? 2 : 1;
    const nuH = ((1 / ph) * dh) / Math.abs(thetaB);
    let phi = new Float64Array(m).fill(1);
    let lambda = 0;
    for (let it = 0; it < 500; it++) {
      const next = channel(m, Float64Array.from(phi, (v, k) => -w[k] * v), lower, upper);
      let num = 0; let den = 0;
      for (let k = 0; k < m; k++) { num += w[k] * phi[k] * phi[k]; den += w[k] * phi[k] * next[k]; }
      const est = num / den;
      const norm = Math.sqrt(next.reduce((s, v) => s + v * v, 0));
      phi = Float64Array.from(next, (v) => v / norm);
      if (Math.abs(est - lambda) < 1e-13 * est) { lambda = est; break; }
      lambda = est;
    }
    // Nu_T = λ (A/P_h) D_h (the same energy balance with θ decaying as e^{−λ α z/u_m}).
    const nuT = lambda * (1 / ph) * dh;
    return { fRe: (2 * dh * dh) / um, nuH, nuT };
  };
  const c = solve(n);
  const f = solve(2 * n);
  const ex = (x: number, y: number) => (4 * y - x) / 3;
  const result = { fRe: ex(c.fRe, f.fRe), nuH: ex(c.nuH, f.nuH), nuT: ex(c.nuT, f.nuT) };
  platesCache.set(key, result);
  return result;
}

/**
 * Concentric annulus, radius ratio r* = r_i/r_o, laminar fully developed: f·Re on D_h = 2(r_o − r_i), and the
 * uniform-flux Nusselt numbers with one wall heated and the other insulated: Nu_ii (inner heated) and
 * Nu_oo (outer heated), T − T_wall of the heated wall. Finite differences in r (second order, extrapolated).
 */
export function annulusFd(rStar: number, n = 400): { fRe: number; nuInner: number; nuOuter: number } {
  const solve = (m: number) => {
    // y ∈ [0,1] maps to r = r* + (1 − r*) y (r_o = 1); derivatives in y scale by 1/(1 − r*)².
    const span = 1 - rStar;
    const r = (y: number) => rStar + span * y;
    const scale = span * span;
    const u = channel(m, new Float64Array(m).fill(-scale), 'fixed', 'fixed', r);
    const weights = Array.from({ length: m }, (_, i) => r((i + 0.5) / m));
    const areaSum = weights.reduce((s, v) => s + v, 0);
    const um = u.reduce((s, v, i) => s + v * weights[i], 0) / areaSum;
    const w = Float64Array.from(u, (v) => v / um);
    const dh = 2 * span;
    // Area (per unit angle) = (1 − r*²)/2; heated perimeter (per unit angle) = r_heated.
    const area = (1 - rStar * rStar) / 2;
    const nu = (heatedInner: boolean) => {
      const th = channel(m, Float64Array.from(w, (v) => v * scale), heatedInner ? 'fixed' : 'insulated', heatedInner ? 'insulated' : 'fixed', r);
      const thetaB = th.reduce((s, v, i) => s + v * w[i] * weights[i], 0) / areaSum;
      // The wall value is 0 at the heated wall; flux per unit heated perimeter = area / r_heated.
      const rh = heatedInner ? rStar : 1;
      return ((area / rh) * dh) / Math.abs(thetaB);
    };
    return { fRe: (2 * dh * dh) / um, nuInner: nu(true), nuOuter: nu(false) };
  };
  const c = solve(n);
  const f = solve(2 * n);
  const ex = (x: number, y: number) => (4 * y - x) / 3;
  return { fRe: ex(c.fRe, f.fRe), nuInner: ex(c.nuInner, f.nuInner), nuOuter: ex(c.nuOuter, f.nuOuter) };
}
