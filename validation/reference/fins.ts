/**
 * The fin equation solved numerically, independent of the closed forms in the library: steady
 * one-dimensional conduction along a fin of any cross-section with convection from its faces,
 *
 *   d/ds (k A(s) dθ/ds) = h P(s) θ,   θ(0) = 1 (base),   tip: −k A dθ/ds = h A_tip θ (or adiabatic),
 *
 * by a conservative second-order finite-volume scheme (a tridiagonal system, Thomas algorithm). The
 * heat leaving the base is the sum of what every cell convects (an energy balance, not a derivative),
 * so efficiency = q / (h · fin surface). Discretization error is O(Δ²), about 1e-6 with the default
 * 800 cells — far below any tolerance the library uses and well above rounding, so agreement with a
 * closed form is evidence, not a copy of it (validation/library.test.ts flags agreement to 1e-9).
 */

export interface FinGeometry {
  /** Fin length from base to tip (m). */
  length: number;
  /** Conduction cross-section A(s) (m²) at distance s from the base. */
  area: (s: number) => number;
  /** Wetted perimeter P(s) (m): convecting surface per unit length at s. */
  perimeter: (s: number) => number;
  /** Area of the tip face (m²) that convects when the tip is not adiabatic. */
  tipArea?: number;
}

export interface FinResult {
  /** Heat leaving the base per unit base excess temperature (W/K). */
  q: number;
  /** q / (h · convecting surface): the surface counts the tip face when it convects. */
  efficiency: number;
  /** Excess temperature at the tip relative to the base. */
  tipTheta: number;
}

export function solveFin(g: FinGeometry, h: number, k: number, tip: 'adiabatic' | 'convective', cells = 800): FinResult {
  const n = cells;
  const ds = g.length / n;
  // Unknowns θ1 … θn (θ0 = 1). Node i sits at s = i·ds; faces at (i ± ½)ds; the tip node owns half a cell.
  const a = new Float64Array(n + 1);
  const b = new Float64Array(n + 1);
  const c = new Float64Array(n + 1);
  const d = new Float64Array(n + 1);
  const tipArea = tip === 'convective' ? (g.tipArea ?? 0) : 0;
  for (let i = 1; i <= n; i++) {
    const s = i * ds;
    const west = (k * g.area(s - ds / 2)) / ds;
    if (i < n) {
      const east = (k * g.area(s + ds / 2)) / ds;
      a[i] = -west;
      c[i] = -east;
      b[i] = west + east + h * g.perimeter(s) * ds;
    } else {
      a[i] = -west;
      b[i] = west + (h * g.perimeter(s) * ds) / 2 + h * tipArea;
    }
    if (i === 1) d[i] = west; // the known θ0 = 1 moves to the right-hand side
  }
  for (let i = 2; i <= n; i++) {
    const m = a[i] / b[i - 1];
    b[i] -= m * c[i - 1];
    d[i] -= m * d[i - 1];
  }
  const theta = new Float64Array(n + 1);
  theta[0] = 1;
  theta[n] = d[n] / b[n];
  for (let i = n - 1; i >= 1; i--) theta[i] = (d[i] - c[i] * theta[i + 1]) / b[i];
  // Energy balance: what every cell convects, trapezoid weights (half cells at both ends), plus the tip face.
  let q = 0;
  let surface = 0;
  for (let i = 0; i <= n; i++) {
    const w = i === 0 || i === n ? ds / 2 : ds;
    q += h * g.perimeter(i * ds) * theta[i] * w;
    surface += g.perimeter(i * ds) * w;
  }
  q += h * tipArea * theta[n];
  surface += tipArea;
  return { q, efficiency: q / (h * surface), tipTheta: theta[n] };
}

/** Straight fin of rectangular profile, per unit width (w = 1 m, thickness t ≪ w): A = t, P = 2, tip face t. */
export const straightRectangular = (t: number, L: number): FinGeometry => ({ length: L, area: () => t, perimeter: () => 2, tipArea: t });

/** Pin fin of diameter D: A = πD²/4, P = πD, tip face πD²/4. */
export const pin = (D: number, L: number): FinGeometry => ({ length: L, area: () => (Math.PI * D * D) / 4, perimeter: () => Math.PI * D, tipArea: (Math.PI * D * D) / 4 });

/** Annular fin of thickness t between radii r1 and r2: A = 2πrt, P = 4πr (both faces), tip face 2πr2·t. */
export const annular = (t: number, r1: number, r2: number): FinGeometry => ({
  length: r2 - r1,
  area: (s) => 2 * Math.PI * (r1 + s) * t,
  perimeter: (s) => 4 * Math.PI * (r1 + s),
  tipArea: 2 * Math.PI * r2 * t,
});

/** Straight fin of triangular profile, base thickness tb, per unit width: thickness tb(1 − s/L), faces ≈ 2 per unit length (thin fin). */
export const straightTriangular = (tb: number, L: number): FinGeometry => ({ length: L, area: (s) => tb * (1 - s / L), perimeter: () => 2, tipArea: 0 });
