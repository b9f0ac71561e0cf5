/**
 * Fully developed laminar mixed convection in a vertical tube with a uniform wall heat flux, solved here by finite
 * differences, independent of the table the library definition holds (which comes from the power-series solution,
 * scripts/mixed-convection-table.py).
 *
 * With η = r/R, the velocity û = u/u_m and the temperature θ̂ = (T − T_w)/(A R² u_m/α), A = dT_m/dx the axial
 * temperature gradient, the Boussinesq equations reduce to two coupled linear equations (Morton 1960):
 *   L û = Π − Ra θ̂,   L θ̂ = û,   L = (1/η) d/dη (η d/dη),
 *   û(1) = θ̂(1) = 0, regular at η = 0, ∫₀¹ 2 û η dη = 1 (which fixes the pressure gradient Π),
 * Ra = gβ A R⁴/(να): positive when buoyancy aids the flow (heated upflow), negative when it opposes it.
 * The Nusselt number on the diameter is Nu = 2 R q/(k (T_w − T_m)) = 1/(−θ̂_m), θ̂_m = ∫₀¹ 2 û θ̂ η dη
 * (the wall gradient θ̂′(1) = ∫₀¹ û η dη = ½ by the energy balance).
 *
 * Second-order conservative differences on n cells (node 0 at the axis, where L f = 4 (f₁ − f₀)/h²), the
 * (2n + 1) unknowns solved by Gaussian elimination; two grids are Richardson-extrapolated, leaving about 1e-6.
 */

/** Nu and the wall slope of û (positive means the flow has reversed at the wall) on n cells. */
export function verticalTubeMixedGrid(ra: number, n: number): { nu: number; wallSlope: number } {
  const h = 1 / n;
  // Unknowns: û_0..û_{n−1}, θ̂_0..θ̂_{n−1} (û_n = θ̂_n = 0), Π.
  const m = 2 * n + 1;
  const A = Array.from({ length: m }, () => new Float64Array(m + 1));
  const U = (i: number) => i;
  const T = (i: number) => n + i;
  const P = 2 * n;
  // L f at node i: coefficients on f_{i−1}, f_i, f_{i+1}.
  const lap = (i: number): [number, number, number] => {
    if (i === 0) return [0, -4 / (h * h), 4 / (h * h)];
    const eta = i * h;
    const w = (eta - h / 2) / (eta * h * h);
    const e = (eta + h / 2) / (eta * h * h);
    return [w, -(w + e), e];
  };
  for (let i = 0; i < n; i++) {
    const [w, c, e] = lap(i);
    // Momentum: L û + Ra θ̂ − Π = 0.
    const rowU = A[U(i)];
    if (i > 0) rowU[U(i - 1)] += w;
    rowU[U(i)] += c;
    if (i + 1 < n) rowU[U(i + 1)] += e;
    rowU[T(i)] += ra;
    rowU[P] -= 1;
    // Energy: L θ̂ − û = 0.
    const rowT = A[T(i)];
    if (i > 0) rowT[T(i - 1)] += w;
    rowT[T(i)] += c;
    if (i + 1 < n) rowT[T(i + 1)] += e;
    rowT[U(i)] -= 1;
  }
  // Mean velocity 1: trapezoid rule for ∫ 2 û η dη (û_n = 0).
  for (let i = 1; i < n; i++) A[P][U(i)] = 2 * i * h * h;
  A[P][m] = 1;
  const x = gauss(A, m);
  const u = (i: number) => (i < n ? x[U(i)] : 0);
  const t = (i: number) => (i < n ? x[T(i)] : 0);
  let thetaM = 0;
  for (let i = 1; i < n; i++) thetaM += 2 * u(i) * t(i) * i * h * h;
  const wallSlope = (3 * u(n) - 4 * u(n - 1) + u(n - 2)) / (2 * h);
  return { nu: 1 / -thetaM, wallSlope };
}

/** Nu by 200 and 400 cells, Richardson-extrapolated. */
export function verticalTubeMixedNusselt(ra: number): number {
  const coarse = verticalTubeMixedGrid(ra, 200).nu;
  const fine = verticalTubeMixedGrid(ra, 400).nu;
  return fine + (fine - coarse) / 3;
}

/** Gaussian elimination with partial pivoting on an augmented matrix (m rows, m + 1 columns). */
function gauss(A: Float64Array[], m: number): Float64Array {
  for (let k = 0; k < m; k++) {
    let p = k;
    for (let i = k + 1; i < m; i++) if (Math.abs(A[i][k]) > Math.abs(A[p][k])) p = i;
    [A[k], A[p]] = [A[p], A[k]];
    const piv = A[k][k];
    for (let i = k + 1; i < m; i++) {
      const f = A[i][k] / piv;
      if (f === 0) continue;
      const ri = A[i];
      const rk = A[k];
      for (let j = k; j <= m; j++) ri[j] -= f * rk[j];
    }
  }
  const x = new Float64Array(m);
  for (let k = m - 1; k >= 0; k--) {
    let s = A[k][m];
    for (let j = k + 1; j < m; j++) s -= A[k][j] * x[j];
    x[k] = s / A[k][k];
  }
  return x;
}
