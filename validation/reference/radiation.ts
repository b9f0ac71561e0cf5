/**
 * Thermal radiation references computed here, independent of the closed forms and series in the
 * library:
 * - the fraction of blackbody emission below λT by quadrature of Planck's law (Simpson's rule in
 *   x = C2/(λT), error about 1e-6), with C2 = 14 387.768 775 μm·K (CODATA 2018);
 * - view factors between finite surfaces by numerical integration of the defining double-area integral
 *   F₁₂ = (1/A₁) ∫∫ cos θ₁ cos θ₂ / (π S²) dA₂ dA₁: product midpoint rules for parallel surfaces (error
 *   O(h²), about 1e-4 at the default resolution) and Gauss–Legendre rules graded towards a shared edge,
 *   where the kernel is singular but integrable (about 1e-5).
 * Low-order rules on purpose where a high-order rule would agree with the closed forms to rounding: the
 * quadrature error is stated and the library's tolerances sit above it.
 */

export const C2_UM_K = 14387.768775;

/** Gauss–Legendre nodes and weights on [−1, 1] (Newton on the Legendre recurrence). */
export function gaussLegendre(n: number): { x: Float64Array; w: Float64Array } {
  const x = new Float64Array(n);
  const w = new Float64Array(n);
  for (let i = 0; i < Math.ceil(n / 2); i++) {
    let z = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let dp = 0;
    for (let it = 0; it < 100; it++) {
      let p0 = 1; let p1 = z;
      for (let k = 2; k <= n; k++) { const p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k; p0 = p1; p1 = p2; }
      const pn = n === 1 ? z : p1;
      const pm = n === 1 ? 1 : p0;
      dp = (n * (z * pn - pm)) / (z * z - 1);
      const dz = pn / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-15) break;
    }
    x[i] = -z; x[n - 1 - i] = z;
    w[i] = w[n - 1 - i] = 2 / ((1 - z * z) * dp * dp);
  }
  return { x, w };
}

const GL = new Map<number, { x: Float64Array; w: Float64Array }>();
const gl = (n: number) => { let r = GL.get(n); if (!r) { r = gaussLegendre(n); GL.set(n, r); } return r; };

/** ∫_a^b f by `panels` Gauss–Legendre panels of `order` points. */
export function integrate(f: (x: number) => number, a: number, b: number, panels = 20, order = 10): number {
  const { x, w } = gl(order);
  const h = (b - a) / panels;
  let s = 0;
  for (let p = 0; p < panels; p++) {
    const mid = a + (p + 0.5) * h;
    for (let i = 0; i < order; i++) s += w[i] * f(mid + (h / 2) * x[i]);
  }
  return (s * h) / 2;
}

/** Composite Simpson's rule with n (even) intervals. */
function simpson(f: (x: number) => number, a: number, b: number, n: number): number {
  const h = (b - a) / n;
  let s = f(a) + f(b);
  for (let i = 1; i < n; i++) s += (i % 2 ? 4 : 2) * f(a + i * h);
  return (s * h) / 3;
}

/**
 * F(0 → λT) = (15/π⁴) ∫_{C2/λT}^∞ x³/(eˣ − 1) dx, by Simpson's rule on [x0, x0 + 60] (the tail beyond is
 * below 1e-20), 300 intervals: relative error about 1e-6.
 */
export function blackbodyFraction(lambdaT: number): number {
  const x0 = C2_UM_K / lambdaT;
  const g = (x: number) => (x < 1e-8 ? x * x : (x * x * x) / Math.expm1(x));
  return (15 / Math.PI ** 4) * simpson(g, x0, x0 + 60, 300);
}

/** Midpoints of m equal cells on [0, len]. */
const midpoints = (len: number, m: number) => Array.from({ length: m }, (_, i) => ((i + 0.5) * len) / m);

/** View factor between coaxial parallel disks of radii r1 (emitter) and r2, a distance L apart. */
export function coaxialDisksViewFactor(r1: number, r2: number, L: number, m = Math.min(400, Math.max(60, Math.ceil((40 * Math.max(r1, r2)) / L)))): number {
  // Axisymmetry: a point of disk 1 at radius ρ1 sees disk 2 through ∫₀^{r2} ∫₀^{2π} L²/(π S⁴) ρ2 dφ dρ2,
  // S² = L² + ρ1² + ρ2² − 2ρ1ρ2 cos φ; then F = (1/(π r1²)) ∫₀^{r1} 2π ρ1 (…) dρ1. Midpoint rule in ρ1 and ρ2;
  // the periodic φ-integral by the (spectrally accurate) trapezoid rule.
  const phis = Array.from({ length: 64 }, (_, i) => (2 * Math.PI * i) / 64);
  const cos = phis.map(Math.cos);
  let total = 0;
  for (const rho1 of midpoints(r1, m)) {
    let inner = 0;
    for (const rho2 of midpoints(r2, m)) {
      let ring = 0;
      for (const c of cos) { const s2 = L * L + rho1 * rho1 + rho2 * rho2 - 2 * rho1 * rho2 * c; ring += 1 / (s2 * s2); }
      inner += ((ring * 2 * Math.PI) / 64) * rho2 * (r2 / m);
    }
    total += rho1 * (r1 / m) * ((L * L) / Math.PI) * inner;
  }
  return (2 * total) / (r1 * r1);
}

/** View factor between directly opposed, aligned parallel rectangles X × Y a distance L apart (4-D product midpoint rule). */
export function alignedRectanglesViewFactor(X: number, Y: number, L: number, m = Math.min(48, Math.max(24, Math.ceil((10 * Math.max(X, Y)) / L)))): number {
  const xs = midpoints(X, m);
  const ys = midpoints(Y, m);
  const cell = (X / m) * (Y / m);
  let s = 0;
  for (const x1 of xs) for (const y1 of ys) for (const x2 of xs) for (const y2 of ys) {
    const s2 = L * L + (x1 - x2) ** 2 + (y1 - y2) ** 2;
    s += 1 / (s2 * s2);
  }
  return (s * cell * cell * L * L) / (Math.PI * X * Y);
}

/**
 * View factor from rectangle 1 (width W along the shared edge, depth H) to rectangle 2 (same width W,
 * depth D), perpendicular and sharing the edge. Surface 1 in the plane z = 0 (y from 0 to H), surface 2 in
 * y = 0 (z from 0 to D); both from x = 0 to W. The kernel y1 z2/(π S⁴) is singular where both points
 * approach the shared edge: the depths are integrated on rules graded towards 0 (u = t²).
 */
export function perpendicularRectanglesViewFactor(W: number, H: number, D: number, n = 24): number {
  const { x, w } = gl(n);
  const graded = (len: number) => {
    const pts: [number, number][] = [];
    const panels = 3;
    for (let p = 0; p < panels; p++) for (let i = 0; i < n; i++) {
      const t = (p + (x[i] + 1) / 2) / panels;
      pts.push([len * t * t, len * 2 * t * (w[i] / 2 / panels)]);
    }
    return pts;
  };
  const ys = graded(H);
  const zs = graded(D);
  // The x-integration is done analytically: ∫₀^W∫₀^W dx1 dx2 / (a² + (x1 − x2)²)² with a² = y1² + z2².
  const xIntegral = (a2: number) => {
    const a = Math.sqrt(a2);
    // ∫∫ over the square of 1/(a² + t²)², t = x1 − x2, is ∫_{−W}^{W} (W − |t|)/(a² + t²)² dt = 2∫₀^W (W − t)/(a² + t²)² dt
    const atan = Math.atan(W / a);
    const part1 = W * (W / (2 * a2 * (a2 + W * W)) + atan / (2 * a2 * a));
    const part2 = (1 / (2 * a2)) - (1 / (2 * (a2 + W * W)));
    return 2 * (part1 - part2);
  };
  let s = 0;
  for (const [y1, wy] of ys) for (const [z2, wz] of zs) {
    const a2 = y1 * y1 + z2 * z2;
    s += wy * wz * ((y1 * z2) / Math.PI) * xIntegral(a2);
  }
  return s / (W * H);
}

/** Directly opposed parallel strips of width w, a distance L apart (2-D): F = (1/w) ∫∫ L²/(2 S³) ds₁ ds₂, product midpoint rule. */
export function parallelStripsViewFactor(w: number, L: number, m = Math.min(2000, Math.max(200, Math.ceil((40 * w) / L)))): number {
  const s = midpoints(w, m);
  let sum = 0;
  for (const a of s) for (const b of s) sum += 1 / (L * L + (a - b) ** 2) ** 1.5;
  return (sum * (w / m) ** 2 * L * L) / (2 * w);
}

/** A sphere to a coaxial disk of radius r at distance h from its centre: the solid angle ∫ 2πρ h/(h² + ρ²)^(3/2) dρ over 4π (midpoint rule). */
export function sphereToDiskViewFactor(r: number, h: number, m = 300): number {
  let omega = 0;
  for (const rho of midpoints(r, m)) omega += ((2 * Math.PI * rho * h) / (h * h + rho * rho) ** 1.5) * (r / m);
  return omega / (4 * Math.PI);
}

/**
 * Net flux between two large parallel gray plates by following the radiation: what each plate emits is
 * reflected back and forth, each pass absorbing a share; the series is summed until a term falls below
 * 1e-6 of the first (error about 1e-6).
 */
export function parallelPlatesExchangeSeries(T1: number, T2: number, e1: number, e2: number): number {
  const sigma = 5.670374419e-8;
  const absorbed = (emitted: number, eOther: number, eSelf: number) => {
    // Emitted by one plate: absorbed by the other on the first pass, then reflected between them.
    let beam = emitted;
    let toOther = 0;
    for (let pass = 0; pass < 100000; pass++) {
      const a = beam * eOther;
      toOther += a;
      beam *= (1 - eOther) * (1 - eSelf);
      if (beam < 1e-6 * emitted) break;
    }
    return toOther;
  };
  return absorbed(e1 * sigma * T1 ** 4, e2, e1) - absorbed(e2 * sigma * T2 ** 4, e1, e2);
}
