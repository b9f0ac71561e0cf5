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

/** Pohlhausen: θ'(0) = 1 / ∫₀^∞ exp(−(Pr/2) ∫₀^η f dη') dη, by the trapezoidal rule on the Blasius profile. */
export function pohlhausenNusseltCoefficient(pr: number): number {
  const { profile } = blasius();
  let inner = 0;
  let outer = 0;
  let prev = 1;
  for (let i = 1; i < profile.length; i++) {
    inner += (H / 2) * (profile[i].f + profile[i - 1].f);
    const cur = Math.exp(-(pr / 2) * inner);
    outer += (H / 2) * (cur + prev);
    prev = cur;
  }
  return 1 / outer;
}
