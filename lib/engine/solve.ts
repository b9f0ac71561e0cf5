/**
 * Brent's method for a root of f in [a, b] (R. P. Brent, Algorithms for Minimization without
 * Derivatives, Prentice-Hall 1973, ch. 4): bisection's guarantee with secant/inverse-quadratic speed.
 * Stops when the bracket is narrower than relTol·|x| (plus a tiny absolute floor) or f(x) = 0.
 */
export class NoRootError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'NoRootError';
  }
}

export const SOLVE_REL_TOL = 1e-12;
const MAX_ITERATIONS = 200;

export function brent(f: (x: number) => number, lo: number, hi: number, relTol = SOLVE_REL_TOL): number {
  let a = lo;
  let b = hi;
  let fa = f(a);
  let fb = f(b);
  if (!Number.isFinite(fa) || !Number.isFinite(fb)) {
    throw new NoRootError(`the equation cannot be evaluated at the bracket ends [${lo}, ${hi}] (got ${fa}, ${fb})`);
  }
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa * fb > 0) {
    throw new NoRootError(`the bracket [${lo}, ${hi}] holds no root: the residual has the same sign at both ends (${fa.toPrecision(4)}, ${fb.toPrecision(4)})`);
  }
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let i = 0; i < MAX_ITERATIONS; i++) {
    if (fb * fc > 0) { c = a; fc = fa; d = b - a; e = d; }
    if (Math.abs(fc) < Math.abs(fb)) { a = b; b = c; c = a; fa = fb; fb = fc; fc = fa; }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * relTol * Math.abs(b) + 1e-300;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      let p: number;
      let q: number;
      const s = fb / fa;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q; else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) { e = d; d = p / q; } else { d = m; e = d; }
    } else {
      d = m;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
    if (!Number.isFinite(fb)) throw new NoRootError(`the residual is not finite at ${b}`);
  }
  throw new NoRootError(`no convergence within ${MAX_ITERATIONS} iterations`);
}

/** Linear interpolation in (xs, ys), xs strictly increasing; beyond the ends, the end segment is extended. */
export function interpolate(xs: ArrayLike<number>, ys: ArrayLike<number>, x: number): number {
  const n = xs.length;
  let i: number;
  if (x <= xs[0]) i = 0;
  else if (x >= xs[n - 1]) i = n - 2;
  else {
    let lo = 0;
    let hi = n - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (xs[mid] <= x) lo = mid; else hi = mid;
    }
    i = lo;
  }
  const t = (x - xs[i]) / (xs[i + 1] - xs[i]);
  return ys[i] + t * (ys[i + 1] - ys[i]);
}
