/**
 * Independent numerical solutions of the laminar boundary-layer similarity equations, computed here
 * by fourth-order Runge–Kutta shooting (no data from the project or the reference folder):
 *   Blasius (1908):     f''' + ½ f f'' = 0,  f(0) = f'(0) = 0, f'(∞) = 1
 *   Pohlhausen (1921):  θ'' + ½ Pr f θ' = 0,  θ(0) = 0, θ(∞) = 1 (isothermal wall)
 * Nu_x / Re_x^½ = θ'(0); the velocity thickness η99 is where f' = 0.99.
 */
const H = 0.001;
const ETA_MAX = 12;

type State = [number, number, number];

function integrate(fpp0: number): { fpInf: number; profile: { eta: number; f: number; fp: number }[] } {
  let y: State = [0, 0, fpp0];
  const rhs = (s: State): State => [s[1], s[2], -0.5 * s[0] * s[2]];
  const profile = [{ eta: 0, f: 0, fp: 0 }];
  for (let i = 1; i <= ETA_MAX / H; i++) {
    const k1 = rhs(y);
    const k2 = rhs([y[0] + (H / 2) * k1[0], y[1] + (H / 2) * k1[1], y[2] + (H / 2) * k1[2]]);
    const k3 = rhs([y[0] + (H / 2) * k2[0], y[1] + (H / 2) * k2[1], y[2] + (H / 2) * k2[2]]);
    const k4 = rhs([y[0] + H * k3[0], y[1] + H * k3[1], y[2] + H * k3[2]]);
    y = [0, 1, 2].map((j) => y[j] + (H / 6) * (k1[j] + 2 * k2[j] + 2 * k3[j] + k4[j])) as State;
    profile.push({ eta: i * H, f: y[0], fp: y[1] });
  }
  return { fpInf: y[1], profile };
}

let cached: ReturnType<typeof solve> | undefined;

function solve() {
  let lo = 0.2;
  let hi = 0.5;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (integrate(mid).fpInf > 1) hi = mid; else lo = mid;
  }
  const fpp0 = (lo + hi) / 2;
  const { profile } = integrate(fpp0);
  const k = profile.findIndex((p) => p.fp >= 0.99);
  const a = profile[k - 1];
  const b = profile[k];
  const eta99 = a.eta + ((0.99 - a.fp) / (b.fp - a.fp)) * (b.eta - a.eta);
  let displacement = 0;
  let momentum = 0;
  for (let i = 1; i < profile.length; i++) {
    const p = profile[i];
    const q = profile[i - 1];
    displacement += (H / 2) * (1 - p.fp + (1 - q.fp));
    momentum += (H / 2) * (p.fp * (1 - p.fp) + q.fp * (1 - q.fp));
  }
  return { fpp0, eta99, displacement, momentum, profile };
}

/** Blasius solution: f''(0), η at f' = 0.99, displacement and momentum thickness constants. */
export function blasius() {
  cached ??= solve();
  return cached;
}

/** Blasius f(η) with the far field continued analytically: f → η − β (β = displacement constant). */
function fAt(i: number): number {
  const { profile, displacement } = blasius();
  return i < profile.length ? profile[i].f : i * H - displacement;
}

/**
 * Pohlhausen, isothermal wall: Nu_x/Re_x^½ = 1 / ∫₀^∞ exp(−(Pr/2) ∫₀^η f dη') dη (trapezoidal rule).
 * The integral runs far enough for small Pr, whose thermal layer is much thicker than the velocity layer.
 */
function pohlhausenNusseltCoefficientSolved(pr: number): number {
  const etaMax = Math.max(ETA_MAX, Math.sqrt(80 / pr) + 4);
  let inner = 0;
  let outer = 0;
  let prev = 1;
  for (let i = 1; i * H <= etaMax; i++) {
    inner += (H / 2) * (fAt(i) + fAt(i - 1));
    const cur = Math.exp(-(pr / 2) * inner);
    outer += (H / 2) * (cur + prev);
    prev = cur;
  }
  return 1 / outer;
}

/** η where the isothermal-wall temperature profile reaches 99 % of the free-stream difference. */
function thermalThicknessEtaSolved(pr: number): number {
  const etaMax = Math.max(ETA_MAX, Math.sqrt(80 / pr) + 4);
  const w: number[] = [1];
  let inner = 0;
  for (let i = 1; i * H <= etaMax; i++) {
    inner += (H / 2) * (fAt(i) + fAt(i - 1));
    w.push(Math.exp(-(pr / 2) * inner));
  }
  const cum = [0];
  for (let i = 1; i < w.length; i++) cum.push(cum[i - 1] + (H / 2) * (w[i] + w[i - 1]));
  const total = cum[cum.length - 1];
  const k = cum.findIndex((c) => c / total >= 0.99);
  const a = cum[k - 1] / total;
  const b = cum[k] / total;
  return (k - 1 + (0.99 - a) / (b - a)) * H;
}

/**
 * Wall temperature growing as x^n over the Blasius flow: θ'' + (Pr/2) f θ' − n Pr f' θ = 0, θ(0) = 1,
 * θ(∞) = 0; Nu_x/Re_x^½ = −θ'(0). n = ½ is the uniform-heat-flux plate (q ∝ x^(n−½)). The equation is
 * linear, so two trial integrations give the slope exactly.
 */
function powerLawWallNusseltCoefficientSolved(pr: number, n: number): number {
  const { profile } = blasius();
  const etaMax = Math.min(ETA_MAX, Math.max(8, 12 / Math.sqrt(pr)));
  const run = (slope: number) => {
    let t = 1;
    let tp = slope;
    const fp = (i: number) => profile[Math.min(i, profile.length - 1)].fp;
    const rhs = (i: number, a: number, b: number) => -(pr / 2) * fAt(i) * b + n * pr * fp(i) * a;
    for (let i = 0; i * H < etaMax; i++) {
      // Heun's method on the tabulated profile (its step equals the profile's spacing).
      const k1t = tp;
      const k1p = rhs(i, t, tp);
      const k2t = tp + H * k1p;
      const k2p = rhs(i + 1, t + H * k1t, tp + H * k1p);
      t += (H / 2) * (k1t + k2t);
      tp += (H / 2) * (k1p + k2p);
    }
    return t;
  };
  const t0 = run(0);
  const t1 = run(-1);
  // θ(∞) is linear in the slope s: θ∞(s) = t0 + s (t0 − t1); its zero gives −θ'(0) = t0 / (t0 − t1).
  return t0 / (t0 - t1);
}

/**
 * Graetz problem, uniform wall temperature, fully developed: (1/r)(r φ')' + λ² (1 − r²) φ = 0,
 * φ'(0) = 0, φ(1) = 0; Nu_D = λ₀²/2 for the first eigenvalue (Shah & London 1978 give 3.6568).
 */
export function graetzNusseltUWT(): number {
  const { lambda } = graetzPairs()[0];
  return (lambda * lambda) / 2;
}

/**
 * Ostrach (1953) laminar free convection on an isothermal vertical plate:
 *   F''' + 3 F F'' − 2 F'² + H = 0,  H'' + 3 Pr F H' = 0,
 *   F(0) = F'(0) = 0, H(0) = 1, F'(∞) = H(∞) = 0, with η = (y/x)(Gr_x/4)^¼.
 * Returns g(Pr) = −H'(0), so Nu_x = g (Gr_x/4)^¼ and Nu_L = (4/3) g (Gr_L/4)^¼. Newton iteration on
 * (F''(0), H'(0)) with RK4 integration to η = 8, continued in Pr from Pr = 1; used for 0.7 ≤ Pr ≤ 1 (gases).
 */
function ostrachGSolved(pr: number): number {
  const etaMax = 8;
  const h = 0.002;
  let a = 0.64;
  let b = -0.57;
  const solveAt = (p: number) => {
    const shoot = (fa: number, fb: number): [number, number] => {
      let y = [0, 0, fa, 1, fb];
      const rhs = (s: number[]) => [s[1], s[2], -3 * s[0] * s[2] + 2 * s[1] * s[1] - s[3], s[4], -3 * p * s[0] * s[4]];
      for (let eta = 0; eta < etaMax - 1e-12; eta += h) {
        const k1 = rhs(y);
        const k2 = rhs(y.map((v, i) => v + (h / 2) * k1[i]));
        const k3 = rhs(y.map((v, i) => v + (h / 2) * k2[i]));
        const k4 = rhs(y.map((v, i) => v + h * k3[i]));
        y = y.map((v, i) => v + (h / 6) * (k1[i] + 2 * k2[i] + 2 * k3[i] + k4[i]));
      }
      return [y[1], y[3]];
    };
    for (let it = 0; it < 50; it++) {
      const [r1, r2] = shoot(a, b);
      if (Math.abs(r1) < 1e-11 && Math.abs(r2) < 1e-11) return;
      const d = 1e-7;
      const [p1, p2] = shoot(a + d, b);
      const [q1, q2] = shoot(a, b + d);
      const j11 = (p1 - r1) / d;
      const j12 = (q1 - r1) / d;
      const j21 = (p2 - r2) / d;
      const j22 = (q2 - r2) / d;
      const det = j11 * j22 - j12 * j21;
      const da = (r1 * j22 - r2 * j12) / det;
      const db = (j11 * r2 - j21 * r1) / det;
      const damp = Math.min(1, 0.2 / Math.max(Math.abs(da), Math.abs(db), 1e-300));
      a -= da * damp;
      b -= db * damp;
    }
    throw new Error(`Ostrach similarity did not converge at Pr = ${p}`);
  };
  const steps = Math.max(1, Math.ceil(Math.abs(Math.log(pr)) / Math.log(1.5)));
  for (let k = 1; k <= steps; k++) solveAt(Math.exp((Math.log(pr) * k) / steps));
  return -b;
}

/** The Prandtl-number solutions are solved once per Pr: the circularity test asks for the same Pr many times. */
function memoByPr(solve: (pr: number) => number): (pr: number) => number {
  const cache = new Map<number, number | Error>();
  return (pr) => {
    let v = cache.get(pr);
    if (v === undefined) {
      try { v = solve(pr); } catch (err) { v = err as Error; }
      if (cache.size > 1000) cache.clear();
      cache.set(pr, v);
    }
    if (v instanceof Error) throw v;
    return v;
  };
}

export const pohlhausenNusseltCoefficient = memoByPr(pohlhausenNusseltCoefficientSolved);
export const thermalThicknessEta = memoByPr(thermalThicknessEtaSolved);
export const ostrachG = memoByPr(ostrachGSolved);
const powerLawByExponent = new Map<number, (pr: number) => number>();
/** Nusselt coefficient for a wall temperature rising as x^n (n = ½: uniform heat flux), solved once per (Pr, n). */
export function powerLawWallNusseltCoefficient(pr: number, n: number): number {
  let f = powerLawByExponent.get(n);
  if (!f) { f = memoByPr((p) => powerLawWallNusseltCoefficientSolved(p, n)); powerLawByExponent.set(n, f); }
  return f(pr);
}

/**
 * Graetz (1883) thermal entrance, Poiseuille flow, uniform wall temperature: the series solution
 * θ(r, ζ) = Σ cₙ φₙ(r) exp(−λₙ² ζ/2) with ζ = 4 (x/D)/(Re_D Pr), from the first 24 eigenpairs of
 * (1/r)(r φ')' + λ² (1 − r²) φ = 0 found by RK4 shooting and bisection, the coefficients by
 * orthogonality with the weight r (1 − r²) (Simpson's rule). Mean Nusselt number over 0…x from the
 * energy balance: Nu_m = −ln θ_m(ζ)/ζ. Truncation error below 1e-6 for ζ ≥ 0.004.
 */
/**
 * Classical fourth-order Runge–Kutta for y″ = acc(x, y, y′) from x0 in `steps` steps of h; `each` sees y
 * after every step. Returns y and y′ at the end.
 */
function rk4Second(acc: (x: number, y: number, yp: number) => number, x0: number, y0: number, yp0: number, h: number, steps: number, each?: (y: number) => void) {
  let y = y0;
  let yp = yp0;
  for (let i = 0; i < steps; i++) {
    const x = x0 + i * h;
    const k1 = [yp, acc(x, y, yp)];
    const k2 = [yp + (h / 2) * k1[1], acc(x + h / 2, y + (h / 2) * k1[0], yp + (h / 2) * k1[1])];
    const k3 = [yp + (h / 2) * k2[1], acc(x + h / 2, y + (h / 2) * k2[0], yp + (h / 2) * k2[1])];
    const k4 = [yp + h * k3[1], acc(x + h, y + h * k3[0], yp + h * k3[1])];
    y += (h / 6) * (k1[0] + 2 * k2[0] + 2 * k3[0] + k4[0]);
    yp += (h / 6) * (k1[1] + 2 * k2[1] + 2 * k3[1] + k4[1]);
    each?.(y);
  }
  return { y, yp };
}

/** Composite Simpson's rule over samples g(0) … g(cells) spaced h apart (cells even). */
export function simpsonSamples(cells: number, h: number, g: (i: number) => number): number {
  let s = g(0) + g(cells);
  for (let i = 1; i < cells; i++) s += (i % 2 ? 4 : 2) * g(i);
  return (s * h) / 3;
}

const GRAETZ_STEPS = 4000;
let graetzCache: { lambda: number; weight: number }[] | undefined;

function graetzPairs() {
  if (graetzCache) return graetzCache;
  const h = 1 / GRAETZ_STEPS;
  const shoot = (lambda: number, keep = false) => {
    const l2 = lambda * lambda;
    const acc = (r: number, p: number, dp: number) => (r === 0 ? -l2 * p / 2 : -dp / r - l2 * (1 - r * r) * p);
    const values = keep ? [1] : [];
    const { y } = rk4Second(acc, 0, 1, 0, h, GRAETZ_STEPS, keep ? (phi) => values.push(phi) : undefined);
    return { wall: y, values };
  };
  const simpsonGrid = (g: (i: number) => number) => simpsonSamples(GRAETZ_STEPS, h, g);
  const pairs: { lambda: number; weight: number }[] = [];
  let a = 0.5;
  let fa = shoot(a).wall;
  while (pairs.length < 24) {
    const b = a + 0.5;
    const fb = shoot(b).wall;
    if (fa * fb < 0) {
      let lo = a;
      let hi = b;
      let flo = fa;
      for (let i = 0; i < 50; i++) {
        const mid = (lo + hi) / 2;
        const fm = shoot(mid).wall;
        if (flo * fm <= 0) hi = mid; else { lo = mid; flo = fm; }
      }
      const lambda = (lo + hi) / 2;
      const { values } = shoot(lambda, true);
      const w = (i: number) => i * h * (1 - (i * h) ** 2);
      const num = simpsonGrid((i) => w(i) * values[i]);
      const den = simpsonGrid((i) => w(i) * values[i] ** 2);
      // θ_m contribution: cₙ · 4 ∫ r (1 − r²) φₙ dr with cₙ = num/den.
      pairs.push({ lambda, weight: (num / den) * 4 * num });
    }
    a = b;
    fa = fb;
  }
  graetzCache = pairs;
  return pairs;
}

/** Mean Nusselt number over the thermal entrance length (Graetz series), given L/D over Re_D·Pr. */
export function graetzMeanNusselt(lOverDOverRePr: number): number {
  const zeta = 4 * lOverDOverRePr;
  if (!(zeta >= 0.004)) throw new RangeError(`(L/D)/(Re Pr) = ${lOverDOverRePr} is too short for 24 terms of the series`);
  const thetaM = graetzPairs().reduce((s, p) => s + p.weight * Math.exp((-p.lambda * p.lambda * zeta) / 2), 0);
  return -Math.log(thetaM) / zeta;
}

/**
 * Lévêque (1928) thin-layer limit Pr → ∞ for a uniform wall flux on a flat plate: in the thermal layer the
 * velocity is the wall shear's, u = a(x) y with a = U f″(0) (U/νx)^½, and continuity gives v = −a′ y²/2
 * (not negligible: a varies with x). With ζ = y/g(x), g³ = α/(U f″(0) (U/ν)^½) · x^{3/2}, and
 * T − T_∞ = (q g/k) θ(ζ), the energy equation u T_x + v T_y = α T_yy becomes θ″ = ½ ζ θ − ¼ ζ² θ′,
 * θ′(0) = −1, θ′(∞) = 0 (the other solution grows as ζ²). Nu_x = f″(0)^⅓ Re_x^½ Pr^⅓ / θ(0).
 * The same scaling for an isothermal wall gives θ″ = −¼ ζ² θ′ and Lighthill's (f″(0)/12)^⅓/Γ(4/3) = 0.3387.
 * Returns the coefficient f″(0)^⅓/θ(0), by RK4 shooting on θ(0) (the problem is linear in it).
 */
let uniformFluxLeveque: number | undefined;
export function levequeUniformFluxCoefficient(): number {
  if (uniformFluxLeveque !== undefined) return uniformFluxLeveque;
  const run = (t0: number) => rk4Second((z, a, b) => 0.5 * z * a - 0.25 * z * z * b, 0, t0, -1, 1e-3, 8000).yp;
  const a = run(0);
  const b = run(1);
  const theta0 = -a / (b - a);
  uniformFluxLeveque = Math.cbrt(blasius().fpp0) / theta0;
  return uniformFluxLeveque;
}
