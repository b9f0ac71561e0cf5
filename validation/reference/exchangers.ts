/**
 * Heat-exchanger models solved numerically, independent of the closed-form effectiveness relations in
 * the library. Everything is non-dimensional: the hot fluid enters at 1, the cold at 0, NTU = UA/C_min,
 * C_r = C_min/C_max, and the effectiveness is ε = q / (C_min · 1). U and the capacity rates are constant
 * along the exchanger (the assumptions of every closed form they check).
 *
 * - two-stream exchangers (parallel flow, counterflow, C_r = 0): the temperature ODEs integrated by the
 *   second-order midpoint rule; counterflow is a boundary-value problem solved by superposing two
 *   integrations (the equations are linear);
 * - one shell pass, two tube passes (the "1-2" exchanger of Nagle 1933 and Bowman, Mueller & Nagle 1940):
 *   shell temperature mixed over the cross-section at each station, three ODEs, shooting on the outlet of
 *   the second tube pass so that both passes meet at the return end;
 * - cross-flow: a grid of N × N cells, each a small exchanger with the mean of its inlet and outlet
 *   temperatures (second order in 1/N); a "mixed" stream carries one temperature across each row;
 * - cross-flow with both streams unmixed also by the exact series of Mason (1955) (as written by
 *   Baclic 1990), an independent analytical route.
 * Discretization errors are about 1e-6 with the default resolutions.
 */

type Vec = number[];

/** y' = A y integrated from 0 to 1 by the midpoint rule in `steps` steps. */
function integrateLinear(A: number[][], y0: Vec, steps: number): Vec {
  const n = y0.length;
  const h = 1 / steps;
  const mul = (y: Vec) => A.map((row) => row.reduce((s, a, j) => s + a * y[j], 0));
  let y = y0.slice();
  for (let s = 0; s < steps; s++) {
    const k1 = mul(y);
    const mid = y.map((v, i) => v + (h / 2) * k1[i]);
    const k2 = mul(mid);
    y = y.map((v, i) => v + h * k2[i]);
  }
  return y.slice(0, n);
}

/** Parallel flow: both streams along +x. The hot stream is C_min. */
export function parallelFlowEffectiveness(ntu: number, cr: number, steps = 400): number {
  // θh' = −NTU (θh − θc), θc' = +NTU C_r (θh − θc)
  const [th] = integrateLinear([[-ntu, ntu], [ntu * cr, -ntu * cr]], [1, 0], steps);
  return 1 - th;
}

/** Counterflow: hot along +x from x = 0, cold along −x from x = 1. The hot stream is C_min. */
export function counterflowEffectiveness(ntu: number, cr: number, steps = 400): number {
  // Along +x: θh' = −NTU (θh − θc); the cold stream flows the other way, so θc' = −NTU C_r (θh − θc).
  const A = [[-ntu, ntu], [-ntu * cr, ntu * cr]];
  // θc(0) is the cold outlet, unknown: θc(1) = 0 is linear in it.
  const a = integrateLinear(A, [1, 0], steps);
  const b = integrateLinear(A, [1, 1], steps);
  const outlet = -a[1] / (b[1] - a[1]);
  const end = integrateLinear(A, [1, outlet], steps);
  return 1 - end[0];
}

/** C_r = 0 (one stream at constant temperature, condensing or boiling): θ' = −NTU (θ − 0). */
export function singleStreamEffectiveness(ntu: number, steps = 400): number {
  const [t] = integrateLinear([[-ntu]], [1], steps);
  return 1 - t;
}

/**
 * One shell pass, two tube passes. `shellIsMin` chooses which fluid flows in the shell; the shell fluid
 * is the hot one. Returns the effectiveness on C_min. The tube fluid's first pass runs with the shell
 * flow, the second against it; each pass has half the area.
 */
export function oneShellTwoTubePassEffectiveness(ntu: number, cr: number, shellIsMin = true, steps = 400): number {
  const cs = shellIsMin ? 1 : 1 / cr; // capacity rates in units of C_min
  const ct = shellIsMin ? 1 / cr : 1;
  const ua = ntu; // UA in units of C_min
  // y = [θs, θ1, θ2] along +x (the shell flow direction); pass 2 flows along −x.
  const A = [
    [-ua / cs, ua / (2 * cs), ua / (2 * cs)],
    [ua / (2 * ct), -ua / (2 * ct), 0],
    [-ua / (2 * ct), 0, ua / (2 * ct)],
  ];
  // Unknown: θ2(0), the tube outlet; the condition is θ2(1) = θ1(1) (the return header), linear in it.
  const gap = (out: number) => { const e = integrateLinear(A, [1, 0, out], steps); return e[2] - e[1]; };
  const g0 = gap(0);
  const g1 = gap(1);
  const outlet = -g0 / (g1 - g0);
  const shellOut = integrateLinear(A, [1, 0, outlet], steps)[0];
  return (cs * (1 - shellOut)) / 1; // q / C_min, with C_min = 1
}

/**
 * Cross-flow on an N × N grid of cells. Stream 1 is C_min (flows along x, one strip per row), stream 2
 * is C_max (flows along y, one strip per column). `mixed` names the stream whose temperature is uniform
 * across its flow section at every station: 'Cmin' mixes stream 1 after every column, 'Cmax' mixes
 * stream 2 after every row. Each cell exchanges U·ΔA times the difference of the means of its inlet and
 * outlet temperatures, solved exactly for the cell (second order in 1/N).
 */
export function crossflowEffectiveness(ntu: number, cr: number, mixed: 'none' | 'Cmin' | 'Cmax' = 'none', cells = 200): number {
  // Mixing after every row or column is a first-order splitting: Richardson's extrapolation of N and 2N restores second order.
  if (mixed !== 'none') return 2 * crossflowGrid(ntu, cr, mixed, 2 * cells) - crossflowGrid(ntu, cr, mixed, cells);
  return crossflowGrid(ntu, cr, mixed, cells);
}

function crossflowGrid(ntu: number, cr: number, mixed: 'none' | 'Cmin' | 'Cmax', cells: number): number {
  const n = cells;
  const uaCell = ntu / (n * n);
  const a = uaCell / (1 / n); // stream 1 strip carries C_min/N = 1/N
  const b = uaCell / (1 / cr / n); // stream 2 strip carries C_max/N
  const cell = (t1: number, t2: number) => { const d = (t1 - t2) / (1 + (a + b) / 2); return [t1 - a * d, t2 + b * d]; };
  let out1 = 0;
  if (mixed === 'Cmax') {
    // Row by row: stream 2 enters row j at one temperature T2 across all columns; stream 1 crosses the row.
    let t2 = 0;
    for (let j = 0; j < n; j++) {
      let t1 = 1;
      let rowOut = 0;
      for (let i = 0; i < n; i++) { const [o1, o2] = cell(t1, t2); t1 = o1; rowOut += o2 / n; }
      out1 += t1 / n;
      t2 = rowOut;
    }
  } else {
    // Column by column: stream 1 strips (one per row) cross column i; stream 2 of column i climbs the rows.
    const t1 = new Float64Array(n).fill(1);
    for (let i = 0; i < n; i++) {
      let t2 = 0;
      for (let j = 0; j < n; j++) { const [o1, o2] = cell(t1[j], t2); t1[j] = o1; t2 = o2; }
      if (mixed === 'Cmin') t1.fill(t1.reduce((s, v) => s + v, 0) / n);
    }
    out1 = t1.reduce((s, v) => s + v, 0) / n;
  }
  return 1 - out1;
}

/**
 * Cross-flow, both streams unmixed, exact: the series of Mason (1955) in Baclic's (1990) form,
 * ε = 1/(C_r NTU) Σ_{n≥0} [1 − e^{−NTU} Σ_{m≤n} NTU^m/m!] [1 − e^{−C_r NTU} Σ_{m≤n} (C_r NTU)^m/m!].
 */
export function crossflowUnmixedSeries(ntu: number, cr: number): number {
  const x = ntu;
  const y = cr * ntu;
  let sx = 0; let tx = 1; // partial sums of e^{-x} x^m/m!
  let sy = 0; let ty = 1;
  let total = 0;
  for (let n = 0; n < 2000; n++) {
    sx += tx * Math.exp(-x);
    sy += ty * Math.exp(-y);
    const term = (1 - sx) * (1 - sy);
    total += term;
    tx *= x / (n + 1);
    ty *= y / (n + 1);
    if (term < 1e-16 && n > x + y) break;
  }
  return total / (cr * ntu);
}

/**
 * The LMTD correction factor of a 1-2 exchanger at given P (tube-side temperature effectiveness) and
 * R = C_tube/C_shell, from the ODE model: find the tube-side NTU that gives P (bisection), then
 * F = ΔT_lm,counterflow·(UA)⁻¹·q, i.e. F = ln[(1 − PR)/(1 − P)] / ((1 − R)·NTU_tube) (R ≠ 1) or
 * P/((1 − P)·NTU_tube) (R = 1).
 */
export function oneShellTwoTubeCorrectionFactor(p: number, r: number): number {
  // The tube fluid is cold here (enters at 0); the shell fluid hot. Tube temperature effectiveness P = θt,out.
  const tubeP = (ntuTube: number) => {
    // In units of C_tube: C_shell = 1/R · C_tube. Effectiveness on C_min, converted to the tube side.
    const tubeIsMin = r <= 1;
    const cr = tubeIsMin ? r : 1 / r;
    const ntuMin = tubeIsMin ? ntuTube : ntuTube * r;
    const eps = oneShellTwoTubePassEffectiveness(ntuMin, cr, !tubeIsMin, 200);
    return tubeIsMin ? eps : eps / r; // q/C_tube
  };
  let lo = 1e-6;
  let hi = 1;
  while (tubeP(hi) < p) { hi *= 2; if (hi > 1e3) throw new Error(`P = ${p} is not reachable at R = ${r}`); }
  for (let i = 0; i < 100; i++) { const mid = (lo + hi) / 2; if (tubeP(mid) < p) lo = mid; else hi = mid; }
  const ntu = (lo + hi) / 2;
  return Math.abs(r - 1) < 1e-9 ? p / ((1 - p) * ntu) : Math.log((1 - p * r) / (1 - p)) / ((1 - r) * ntu);
}

/**
 * Mean temperature difference of a counterflow exchanger from its ODE solution: q/(UA) = ∫ΔT dA/A for the
 * exchanger whose terminal differences are dT1 and dT2. Along the area (UA = 1), dΔT/da = −κ ΔT with
 * κ = 1/C_h − 1/C_c; κ is found by bisection on the integrated end value (not from a formula), then the
 * profile is integrated by the trapezoid rule over the midpoint-rule values (error about 1e-6).
 */
export function counterflowMeanTemperatureDifference(dT1: number, dT2: number, steps = 200): number {
  const profile = (kappa: number) => {
    const h = 1 / steps;
    const values = [dT1];
    let y = dT1;
    for (let i = 0; i < steps; i++) { const mid = y + (h / 2) * (-kappa * y); y += h * (-kappa * mid); values.push(y); }
    return values;
  };
  let lo = -60;
  let hi = 60;
  for (let i = 0; i < 200; i++) { const mid = (lo + hi) / 2; if (profile(mid)[steps] > dT2) lo = mid; else hi = mid; }
  const values = profile((lo + hi) / 2);
  let sum = (values[0] + values[steps]) / 2;
  for (let i = 1; i < steps; i++) sum += values[i];
  return sum / steps;
}

/**
 * n one-shell-pass exchangers in counterflow series: each shell's effectiveness from the 1-2 ODE model
 * at NTU/n, the chain composed numerically by shooting on the C_max stream's temperature between shells.
 */
export function nShellsEffectiveness(ntu: number, cr: number, n: number): number {
  const e1 = oneShellTwoTubePassEffectiveness(ntu / n, cr, true, 200);
  // C_min stream A enters shell 1 at 1; C_max stream B enters shell n at 0 and leaves shell 1 at x.
  const march = (x: number) => {
    let ta = 1;
    let tbOut = x;
    let tbIn = 0;
    for (let k = 0; k < n; k++) {
      tbIn = (tbOut - e1 * cr * ta) / (1 - e1 * cr);
      ta -= e1 * (ta - tbIn);
      tbOut = tbIn;
    }
    return { ta, tbIn };
  };
  const a = march(0);
  const b = march(1);
  const x = -a.tbIn / (b.tbIn - a.tbIn);
  return 1 - march(x).ta;
}
