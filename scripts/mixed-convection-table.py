#!/usr/bin/env python3
"""Writes the table of seeders/correlations/pipe-laminar-mixed-convection-vertical-uhf.json.

Fully developed laminar mixed convection in a vertical tube with a uniform wall heat flux (Morton 1960): with
eta = r/R, the velocity u and the temperature theta (T - T_w scaled by A R^2 u_m / alpha) satisfy
L u = Pi - Ra theta, L theta = u, L = (1/eta) d/deta (eta d/deta), u(1) = theta(1) = 0, so L^2 u = -Ra u.
The regular solutions are the power series u = sum a_n eta^(2n) with a_(n+2) = -Ra a_n / ((2n+4)^2 (2n+2)^2),
two free coefficients fixed by u(1) = 0 and the mean velocity; theta follows term by term from L theta = u, and
Nu = 2 R q / (k (T_w - T_m)) = 1/(-theta_m). The series is exact (80 terms, far beyond convergence for
|Ra| <= 1e4); the rows are refined until linear interpolation is within 1e-5 of the series at every mid-point.
The library checks the table against an independent finite-difference solution (validation/reference/mixed.ts).
Python generates data only; the app never runs it. Usage: python3 scripts/mixed-convection-table.py
"""
import json
import math
import os

N_TERMS = 80
RA_MAX = 1e4
TOL = 1e-5
PATH = os.path.join(os.path.dirname(__file__), '..', 'seeders', 'correlations', 'pipe-laminar-mixed-convection-vertical-uhf.json')


def solution(ra):
    """(Nu, du/deta at the wall) of the series solution at Rayleigh number ra."""
    def series(a0, a1):
        a = [0.0] * N_TERMS
        a[0], a[1] = a0, a1
        for n in range(N_TERMS - 2):
            a[n + 2] = -ra * a[n] / ((2 * n + 4) ** 2 * (2 * n + 2) ** 2)
        return a
    f0, f1 = series(1.0, 0.0), series(0.0, 1.0)
    c = -sum(f0) / sum(f1)
    a = [x + c * y for x, y in zip(f0, f1)]
    mean = sum(2 * a[n] / (2 * n + 2) for n in range(N_TERMS))
    a = [x / mean for x in a]
    # theta = sum a_n (eta^(2n+2) - 1)/(2n+2)^2;  theta_m = 2 * integral of u theta eta over (0, 1)
    theta_m = 0.0
    for m in range(N_TERMS):
        for n in range(N_TERMS):
            theta_m += 2 * a[m] * a[n] / (2 * n + 2) ** 2 * (1 / (2 * m + 2 * n + 4) - 1 / (2 * m + 2))
    slope = sum(2 * n * a[n] for n in range(N_TERMS))
    return 1 / -theta_m, slope


def reversal():
    """The opposing-flow Rayleigh number at which the wall shear vanishes (flow reversal starts)."""
    lo, hi = -200.0, -1.0  # slope > 0 (reversed) at lo, < 0 at hi
    for _ in range(80):
        mid = (lo + hi) / 2
        if solution(mid)[1] > 0:
            lo = mid
        else:
            hi = mid
    return hi


def rows(ra_min, ra_max):
    """Keys refined by halving until linear interpolation meets TOL at every mid-point."""
    keys = [ra_min, -50.0, -10.0, 0.0, 10.0, 100.0, 1000.0, ra_max]
    values = {k: solution(k)[0] for k in keys}
    changed = True
    while changed:
        changed = False
        out = [keys[0]]
        for a, b in zip(keys, keys[1:]):
            mid = (a + b) / 2
            exact = solution(mid)[0]
            if abs((values[a] + values[b]) / 2 / exact - 1) > TOL:
                values[mid] = exact
                out.append(mid)
                changed = True
            out.append(b)
        keys = out
    worst = max(abs((values[a] + values[b]) / 2 / solution((a + b) / 2)[0] - 1) for a, b in zip(keys, keys[1:]))
    return keys, [values[k] for k in keys], worst


def main():
    ra_rev = reversal()
    ra_min = math.ceil(ra_rev * 10) / 10  # on the unreversed side
    keys, nus, worst = rows(ra_min, RA_MAX)
    with open(PATH, encoding='utf-8') as f:
        entry = json.load(f)
    table = entry['definition']['tables'][0]
    table['columns'] = [
        {'name': 'Ra_A', 'unit': '1', 'values': [float(f'{k:.10g}') for k in keys]},
        {'name': 'Nu', 'unit': '1', 'values': [float(f'{v:.10g}') for v in nus]},
    ]
    table['source'] = (f'Power-series solution of the fully developed equations (Morton 1960), 80 terms, by '
                       f'scripts/mixed-convection-table.py: {len(keys)} rows, refined until linear interpolation is '
                       f'within {worst * 100:.4f} % of the series at every mid-point.')
    for v in entry['definition']['validity']:
        if v['symbol'] == 'Ra_A':
            v['min'] = ra_min
    with open(PATH, 'w', encoding='utf-8') as f:
        f.write(json.dumps(entry, indent=2, ensure_ascii=False) + '\n')
    print(f'flow reversal at Ra = {ra_rev:.6g}; {len(keys)} rows; worst mid-point interpolation {worst:.2e}')


if __name__ == '__main__':
    main()
