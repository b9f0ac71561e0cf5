/**
 * Laminar film condensation solved here, independent of the closed forms in the library.
 *
 * Vertical isothermal plate, boundary-layer similarity solution of the liquid film with inertia and
 * energy convection (Sparrow & Gregg 1959, J. Heat Transfer 81:13; stagnant vapour, no interfacial
 * shear): with η = c y x^(−¼), c = [g(ρl − ρv)/(4 νl² ρl)]^¼, ψ = 4 νl c x^¾ f(η), θ = (T − T_sat)/(T_w − T_sat),
 *   f‴ + 3 f f″ − 2 f′² + 1 = 0,   θ″ + 3 Pr f θ′ = 0,
 *   f(0) = f′(0) = 0, θ(0) = 1;   at the interface η_δ: f″ = 0, θ = 0, f(η_δ) = −(Ja/(3 Pr)) θ′(η_δ),
 * Ja = c_p (T_sat − T_w)/h_fg. For a chosen η_δ, f″(0) is shot (secant) so that f″(η_δ) = 0; θ is linear,
 * so θ′(0) follows from one integration; Ja follows from the interface balance; η_δ is then found for the
 * given Ja by bisection. The mean coefficient over a plate of height L is h̄ = −(4/3) k θ′(0) c L^(−¼).
 * As Ja → 0 it tends to Nusselt's (1916) h̄ = 0.943 [g ρl (ρl − ρv) k³ h_fg/(μl ΔT L)]^¼.
 *
 * Horizontal tube (Nusselt 1916): the film around a tube of radius R, Γ = ρl(ρl − ρv) g sin φ δ³/(3 μl) per
 * unit length, grows by condensation h_fg dΓ/(R dφ) = k ΔT/δ. With G = sin φ δ³ the film equation is
 * dG/dφ = A (sin φ/G)^⅓, A = 3 μl k ΔT R/(ρl(ρl − ρv) g h_fg), integrated by RK4 from the top (G ≈ φ A^¾),
 * or from a film arriving from the tube above (a vertical column of tubes). The mean coefficient is
 * (1/π) ∫ k/δ dφ by the trapezoid rule.
 */

const G_STD = 9.80665;

interface FilmFluid { rho_l: number; rho_v: number; mu_l: number; k_l: number; cp_l: number; h_fg: number; dT: number; g?: number }

/** RK4 for a first-order system. */
function rk4(f: (x: number, y: number[]) => number[], x0: number, y0: number[], x1: number, steps: number, each?: (x: number, y: number[]) => void): number[] {
  const h = (x1 - x0) / steps;
  let y = y0.slice();
  let x = x0;
  each?.(x, y);
  for (let i = 0; i < steps; i++) {
    const k1 = f(x, y);
    const k2 = f(x + h / 2, y.map((v, j) => v + (h / 2) * k1[j]));
    const k3 = f(x + h / 2, y.map((v, j) => v + (h / 2) * k2[j]));
    const k4 = f(x + h, y.map((v, j) => v + h * k3[j]));
    y = y.map((v, j) => v + (h / 6) * (k1[j] + 2 * k2[j] + 2 * k3[j] + k4[j]));
    x += h;
    each?.(x, y);
  }
  return y;
}

/** For a film of similarity thickness etaD at Prandtl number pr: the Jakob number it belongs to and θ′(0). */
function filmAt(etaD: number, pr: number): { ja: number; thetaP0: number } {
  const steps = 400;
  const momentum = (s: number) => rk4((_x, [f, fp, fpp]) => [fp, fpp, -3 * f * fpp + 2 * fp * fp - 1], 0, [0, 0, s], etaD, steps);
  // f″(η_δ) as a function of f″(0): secant iteration from the Nusselt estimate (linear profile, f″(0) ≈ η_δ).
  let s0 = etaD; let s1 = etaD * 1.05;
  let r0 = momentum(s0)[2]; let r1 = momentum(s1)[2];
  for (let i = 0; i < 60 && Math.abs(r1) > 1e-13; i++) {
    const s2 = s1 - (r1 * (s1 - s0)) / (r1 - r0);
    s0 = s1; r0 = r1; s1 = s2; r1 = momentum(s1)[2];
  }
  // θ = 1 + θ′(0) Φ, Φ″ + 3 Pr f Φ′ = 0, Φ(0) = 0, Φ′(0) = 1, integrated beside the momentum equation.
  const [f, , , phi, phiP] = rk4((_x, [ff, fp, fpp, , p1]) => [fp, fpp, -3 * ff * fpp + 2 * fp * fp - 1, p1, -3 * pr * ff * p1], 0, [0, 0, s1, 0, 1], etaD, steps);
  const thetaP0 = -1 / phi;
  const thetaPD = thetaP0 * phiP;
  return { ja: (-3 * pr * f) / thetaPD, thetaP0 };
}

/** Mean condensation coefficient on a vertical plate of height L by the similarity solution (W/(m² K)). */
export function sparrowGreggPlate(p: FilmFluid & { L: number }): number {
  const g = p.g ?? G_STD;
  const nu = p.mu_l / p.rho_l;
  const pr = (p.mu_l * p.cp_l) / p.k_l;
  const ja = (p.cp_l * p.dT) / p.h_fg;
  // Bisection on η_δ: Ja grows with the film thickness.
  let lo = 1e-3; let hi = 0.5;
  while (filmAt(hi, pr).ja < ja) hi *= 1.5;
  for (let i = 0; i < 80; i++) { const mid = Math.sqrt(lo * hi); if (filmAt(mid, pr).ja < ja) lo = mid; else hi = mid; }
  const { thetaP0 } = filmAt(Math.sqrt(lo * hi), pr);
  const c = ((g * (p.rho_l - p.rho_v)) / (4 * nu * nu * p.rho_l)) ** 0.25;
  return -(4 / 3) * p.k_l * thetaP0 * c * p.L ** -0.25;
}

/**
 * Mean coefficient of the n-th tube (n = 1 top) and of a vertical column of N tubes of diameter D, by the film
 * equation: each tube receives the condensate of the tubes above as a film at its top. `hfg` is the latent heat
 * the caller wants in the balance (h_fg, or a corrected h′_fg).
 */
export function nusseltTubeColumn(p: FilmFluid & { D: number; N: number; hfg?: number }): { first: number; mean: number } {
  const g = p.g ?? G_STD;
  const R = p.D / 2;
  const hfg = p.hfg ?? p.h_fg;
  return filmAroundTubes((3 * p.mu_l * p.k_l * p.dT * R) / (p.rho_l * (p.rho_l - p.rho_v) * g * hfg), p.k_l, p.N);
}

/**
 * The film equation around a column of N tubes with film parameter A = 3 μ k ΔT R/(ρ_film Δρ g h_fg) and film
 * conductivity k: the mean coefficient of the first tube and of the column.
 */
function filmAroundTubes(A: number, k: number, N: number): { first: number; mean: number } {
  // Per side of the tube: G = sin φ δ³ ∝ the film flow; incoming flow per side from above, as G-equivalent: Γ_in = B·G_in.
  const steps = 2000;
  const phi0 = 1e-6; const phi1 = Math.PI - 1e-6;
  let gIn = 0; // what arrives at the top of the tube, per side, in G units (the G at φ = π of the tube above)
  let sum = 0; let first = 0;
  for (let n = 1; n <= N; n++) {
    // Start: with incoming flow G_in at the top, G(φ0) ≈ G_in + φ0·(…): for G_in = 0 use the small-φ series G ≈ φ A^¾.
    const g0 = gIn > 0 ? gIn : phi0 * A ** 0.75;
    let integral = 0; let prevX = phi0; let prevH = 0;
    const last = rk4((x, [G]) => [A * Math.cbrt(Math.sin(x) / Math.max(G, 1e-300))], phi0, [g0], phi1, steps, (x, [G]) => {
      const delta = Math.cbrt(G / Math.max(Math.sin(x), 1e-300));
      const hLocal = k / delta;
      if (x > phi0) integral += ((hLocal + prevH) / 2) * (x - prevX);
      prevX = x; prevH = hLocal;
    });
    const mean = integral / Math.PI;
    if (n === 1) first = mean;
    sum += mean;
    // The film leaving the bottom (G at π, the flow per side) falls onto the next tube's top and splits again in two.
    gIn = last[0];
  }
  return { first, mean: sum / N };
}

/**
 * Stable film boiling on a horizontal cylinder, the laminar vapour film solved like Nusselt's condensate film turned
 * upside down (the film starts at the bottom and leaves at the top; Bromley 1950 set the problem up this way). What
 * the liquid does at the film's outer edge is not known: a liquid that moves freely with the vapour leaves the film
 * surface free of shear (Nusselt's film, coefficient 0.728), a stagnant liquid holds it still, which quarters the flow
 * a film of given thickness carries (Γ ∝ δ³/(12 μ) instead of δ³/(3 μ)) and lowers the coefficient by 4^(−¼) to 0.515.
 * Real films lie between. Returns both bounds (W/(m² K)); `hfg` is the latent heat the caller corrects for the
 * vapour's superheat, used the same way in both.
 */
export function vapourFilmCylinder(p: { rho_l: number; rho_v: number; mu_v: number; k_v: number; hfg: number; dT: number; D: number; g?: number }): { freeSurface: number; stillLiquid: number } {
  const g = p.g ?? G_STD;
  const film = (mu: number) => filmAroundTubes((3 * mu * p.k_v * p.dT * (p.D / 2)) / (p.rho_v * (p.rho_l - p.rho_v) * g * p.hfg), p.k_v, 1).mean;
  return { freeSurface: film(p.mu_v), stillLiquid: film(4 * p.mu_v) };
}
