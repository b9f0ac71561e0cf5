/**
 * Developing laminar flow in a circular tube, solved here by marching, independent of the fitted
 * correlations in the library.
 *
 * Thermal entrance (Graetz–Lévêque problem, Poiseuille velocity already developed): with ζ = x α/(u_m R²)
 * (so x* = x/(D Re Pr) = ζ/4) and θ scaled by the inlet difference (uniform wall temperature) or by
 * q R/k (uniform flux), 2(1 − r²) ∂θ/∂ζ = (1/r) ∂/∂r (r ∂θ/∂r), marched by the Crank–Nicolson scheme (after
 * 40 backward-Euler steps that damp the jump at the wall) on a radial grid stretched towards the wall,
 * with steps growing geometrically from 1e-9. Nusselt numbers from energy balances: uniform wall
 * temperature, local Nu_x = −d ln θ_m/d(4x*) between stations and mean −ln θ_m/(4x*); uniform flux,
 * local Nu_x = 2/(θ_w − θ_m).
 *
 * Hydrodynamic entrance (uniform inlet velocity), the boundary-layer (parabolised) equations of
 * Bodoia & Osterle (1961): u ∂u/∂ξ + V ∂u/∂r = −dP/dξ + (1/r) ∂(r ∂u/∂r)/∂r, continuity, and a constant
 * flow rate; ξ = x ν/(u_m R²) = 4x⁺, implicit in ξ with the convecting velocities lagged one iteration
 * (Picard, iterated to convergence), the pressure gradient found at each station from the flow rate
 * (a bordered tridiagonal solve). The apparent Fanning friction factor follows from the pressure drop:
 * f_app Re = ΔP/(2x⁺) with ΔP = Δp/(ρ u_m²).
 */

function thomas(a: Float64Array, b: Float64Array, c: Float64Array, d: Float64Array): Float64Array<ArrayBuffer> {
  const n = b.length;
  const bb = Float64Array.from(b); const dd = Float64Array.from(d);
  for (let i = 1; i < n; i++) { const m = a[i] / bb[i - 1]; bb[i] -= m * c[i - 1]; dd[i] -= m * dd[i - 1]; }
  const x = new Float64Array(n);
  x[n - 1] = dd[n - 1] / bb[n - 1];
  for (let i = n - 2; i >= 0; i--) x[i] = (dd[i] - c[i] * x[i + 1]) / bb[i];
  return x;
}

/** Node radii 0 = r0 < … < rN = 1, clustered towards the wall: r = sin(π s/2)-type stretching. */
function radialGrid(n: number): Float64Array {
  return Float64Array.from({ length: n + 1 }, (_, i) => Math.sin((Math.PI / 2) * (i / n)));
}

export interface ThermalEntrance {
  /** Local Nusselt number at x* (x/(D Re Pr)). */
  local(xStar: number): number;
  /** Mean Nusselt number over 0…x* (uniform wall temperature only). */
  mean(xStar: number): number;
}

const thermalCache = new Map<string, ThermalEntrance>();

/** The whole entrance solution for one wall condition, marched once to x* = 2 and interpolated (log-linear) between stations. */
export function thermalEntrance(wall: 'temperature' | 'flux', n = 400): ThermalEntrance {
  const key = `${wall}:${n}`;
  const hit = thermalCache.get(key);
  if (hit) return hit;
  const r = radialGrid(n);
  // Finite-volume coefficients of (1/r)(r θ′)′ at the nodes (node 0 on the axis by symmetry).
  const lo = new Float64Array(n + 1); const di = new Float64Array(n + 1); const up = new Float64Array(n + 1); const vol = new Float64Array(n + 1);
  for (let i = 0; i <= n; i++) {
    const rw = i === 0 ? 0 : (r[i] + r[i - 1]) / 2;
    const re = i === n ? r[n] : (r[i] + r[i + 1]) / 2;
    vol[i] = (re * re - rw * rw) / 2; // ∫ r dr over the control volume
    const aw = i === 0 ? 0 : rw / (r[i] - r[i - 1]);
    const ae = i === n ? 0 : re / (r[i + 1] - r[i]);
    lo[i] = aw; up[i] = ae; di[i] = -(aw + ae);
  }
  const u = Float64Array.from(r, (ri) => 2 * (1 - ri * ri));
  // Mass-weighted control-volume capacity: ∫ 2(1 − r²) r dr over the control volume.
  const cap = new Float64Array(n + 1);
  for (let i = 0; i <= n; i++) {
    const rw = i === 0 ? 0 : (r[i] + r[i - 1]) / 2;
    const re = i === n ? 1 : (r[i] + r[i + 1]) / 2;
    cap[i] = (re * re - rw * rw) - (re ** 4 - rw ** 4) / 2;
  }
  const stations: { xs: number; local: number; thetaM: number }[] = [];
  const means: { xs: number; thetaM: number }[] = [];
  let theta = new Float64Array(n + 1).fill(wall === 'temperature' ? 1 : 0);
  if (wall === 'temperature') theta[n] = 0;
  let zeta = 0;
  let dz = 1e-9;
  const mixedMean = (t: Float64Array) => { let s = 0; let m = 0; for (let i = 0; i <= n; i++) { s += cap[i] * t[i]; m += cap[i]; } return s / m; };
  let step = 0;
  while (zeta < 8) {
    // The first steps are backward Euler (damping the wall jump), then Crank–Nicolson (Rannacher's start).
    const w = step++ < 40 ? 1 : 0.5;
    // Crank–Nicolson: cap θ^{k+1} − (dz/2) L θ^{k+1} = cap θ^k + (dz/2) L θ^k (+ the wall flux for the flux condition).
    const a = new Float64Array(n + 1); const b = new Float64Array(n + 1); const c = new Float64Array(n + 1); const d = new Float64Array(n + 1);
    for (let i = 0; i <= n; i++) {
      const Lold = di[i] * theta[i] + (i > 0 ? lo[i] * theta[i - 1] : 0) + (i < n ? up[i] * theta[i + 1] : 0);
      a[i] = -(dz * w) * lo[i];
      c[i] = -(dz * w) * up[i];
      b[i] = cap[i] - (dz * w) * di[i];
      d[i] = cap[i] * theta[i] + dz * (1 - w) * Lold;
    }
    if (wall === 'temperature') { a[n] = 0; b[n] = 1; c[n] = 0; d[n] = 0; } else d[n] += dz * 1; // q″ = 1: r ∂θ/∂r = 1 at r = 1
    theta = thomas(a, b, c, d);
    zeta += dz;
    const tm = mixedMean(theta);
    // Local Nu from the energy balance between stations: uniform wall temperature, Nu_x = −d ln θ_m/d(4x*) (taken at the
    // mid-station); uniform flux, Nu_x = 2/(θ_w − θ_m).
    const prev = means[means.length - 1];
    const local = wall === 'temperature'
      ? (prev ? -(Math.log(tm) - Math.log(prev.thetaM)) / (zeta - 4 * prev.xs) : NaN)
      : 2 / (theta[n] - tm);
    stations.push({ xs: wall === 'temperature' && prev ? (zeta - dz / 2) / 4 : zeta / 4, local, thetaM: tm });
    means.push({ xs: zeta / 4, thetaM: tm });
    dz = Math.min(dz * 1.02, 2e-3);
  }
  const at = <S extends { xs: number }>(list: S[], xStar: number, pick: (s: S) => number) => {
    let k = list.findIndex((s) => s.xs >= xStar);
    if (k <= 0) k = 1;
    const s0 = list[k - 1]; const s1 = list[k];
    const t = (Math.log(xStar) - Math.log(s0.xs)) / (Math.log(s1.xs) - Math.log(s0.xs));
    return pick(s0) + t * (pick(s1) - pick(s0));
  };
  const result: ThermalEntrance = {
    local: (x) => at(stations.filter((s) => Number.isFinite(s.local)), x, (s) => s.local),
    mean: (x) => { if (wall !== 'temperature') throw new Error('mean only for the uniform wall temperature'); return -Math.log(at(means, x, (s) => s.thetaM)) / (4 * x); },
  };
  thermalCache.set(key, result);
  return result;
}

let hydro: { xPlus: number; dP: number }[] | undefined;

/** Apparent Fanning friction factor × Re at x⁺ = x/(D Re) from the marched boundary-layer solution. */
export function apparentFrictionFanning(xPlus: number): number {
  hydro ??= marchHydrodynamic();
  const s = hydro;
  let k = s.findIndex((p) => p.xPlus >= xPlus);
  if (k <= 0) k = 1;
  const a = s[k - 1]; const b = s[k];
  const t = (Math.log(xPlus) - Math.log(a.xPlus)) / (Math.log(b.xPlus) - Math.log(a.xPlus));
  const dP = a.dP + t * (b.dP - a.dP);
  return dP / (2 * xPlus);
}

function marchHydrodynamic(n = 300): { xPlus: number; dP: number }[] {
  const r = radialGrid(n);
  // Control volumes as above; u = 0 at the wall node, symmetry on the axis.
  const rf = (i: number) => (i === 0 ? 0 : (r[i] + r[i - 1]) / 2);
  const rfe = (i: number) => (i === n ? 1 : (r[i] + r[i + 1]) / 2);
  const vol = Float64Array.from({ length: n + 1 }, (_, i) => (rfe(i) ** 2 - rf(i) ** 2) / 2);
  let u = new Float64Array(n + 1).fill(1);
  u[n] = 0;
  // Start with the uniform profile except at the wall; rescale to unit flow rate.
  const flow = (w: Float64Array) => { let s = 0; for (let i = 0; i <= n; i++) s += w[i] * vol[i]; return s / 0.5; };
  const q0 = flow(u); u = Float64Array.from(u, (v) => v / q0);
  const out: { xPlus: number; dP: number }[] = [];
  let xi = 0; let dxi = 1e-8; let P = 0;
  let V = new Float64Array(n + 1);
  while (xi < 4) {
    let next = Float64Array.from(u);
    let dPdx = 0;
    for (let it = 0; it < 50; it++) {
      // Convecting velocities at the new station: ū = (u + next)/2 upwind in ξ, V from continuity of the lagged iterate.
      const ubar = Float64Array.from(u, (v, i) => (v + next[i]) / 2);
      V = radialVelocity(r, u, next, dxi, n);
      // Implicit equation per node: ū (u_new − u_old)/dξ + V ∂u/∂r = −P′ + (1/r)(r u′)′ → A u = rhs − P′·vol
      const a = new Float64Array(n + 1); const b = new Float64Array(n + 1); const c = new Float64Array(n + 1);
      const d1 = new Float64Array(n + 1); const d2 = new Float64Array(n + 1);
      for (let i = 0; i < n; i++) {
        const aw = i === 0 ? 0 : rf(i) / (r[i] - r[i - 1]);
        const ae = rfe(i) / (r[i + 1] - r[i]);
        // convection V ∂u/∂r by upwinding (V < 0 near the wall: flow towards the axis)
        const conv = vol[i] * V[i];
        let cw = 0; let ce = 0; let cp = 0;
        if (i > 0) { if (conv > 0) { cw = -conv / (r[i] - r[i - 1]); cp = conv / (r[i] - r[i - 1]); } else { ce = conv / (r[i + 1] - r[i]); cp = -conv / (r[i + 1] - r[i]); } }
        a[i] = -aw + cw;
        c[i] = -ae + ce;
        b[i] = (vol[i] * ubar[i]) / dxi + aw + ae + cp;
        d1[i] = (vol[i] * ubar[i] * u[i]) / dxi;
        d2[i] = -vol[i];
      }
      a[n] = 0; b[n] = 1; c[n] = 0; d1[n] = 0; d2[n] = 0;
      const s1 = thomas(a, b, c, d1);
      const s2 = thomas(a, b, c, d2);
      // Flow rate fixes P′: flow(s1 + P′ s2) = 1.
      dPdx = (1 - flow(s1)) / flow(s2);
      const trial = Float64Array.from(s1, (v, i) => v + dPdx * s2[i]);
      let change = 0;
      for (let i = 0; i <= n; i++) change = Math.max(change, Math.abs(trial[i] - next[i]));
      next = trial;
      if (change < 1e-11) break;
    }
    P += dPdx * dxi;
    xi += dxi;
    u = next;
    out.push({ xPlus: xi / 4, dP: -P });
    dxi = Math.min(dxi * 1.03, 2e-3);
  }
  return out;
}

/** V = v R/ν from continuity, integrating r V = −∫₀^r r ∂u/∂ξ dr (trapezoid on the nodes). */
function radialVelocity(r: Float64Array, uOld: Float64Array, uNew: Float64Array, dxi: number, n: number): Float64Array<ArrayBuffer> {
  const V = new Float64Array(n + 1);
  let integral = 0;
  for (let i = 1; i <= n; i++) {
    const g0 = (r[i - 1] * (uNew[i - 1] - uOld[i - 1])) / dxi;
    const g1 = (r[i] * (uNew[i] - uOld[i])) / dxi;
    integral += ((g0 + g1) / 2) * (r[i] - r[i - 1]);
    V[i] = -integral / r[i];
  }
  return V;
}
