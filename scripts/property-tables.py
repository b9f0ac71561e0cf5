#!/usr/bin/python3
"""Generates the governed property tables from the international standard formulations, with Debian's
python3-iapws (a general-purpose reference library; Python generates and checks data, the app never
runs it):

- dry air at 101.325 kPa, 200-1500 K: Lemmon, Jacobsen, Penoncello & Friend (2000) equation of state,
  Lemmon & Jacobsen (2004) viscosity and thermal conductivity (iapws.humidAir.Air);
- saturated liquid water, 273.16-600 K: IAPWS-95 (Wagner & Pruss 2002) with the IAPWS 2008 viscosity and
  IAPWS 2011 thermal-conductivity formulations (iapws.IAPWS95, x = 0);
- saturated water vapour over the same range (x = 1).

The spacing is refined until linear interpolation between rows stays within MAX_INTERPOLATION of the
formulation at every mid-point (the figure reached is written into each table's source text), and each
table gets check cases at temperatures that are not rows, from the formulation itself.
Usage: /usr/bin/python3 scripts/property-tables.py   (writes seeders/property-tables/air-properties-1atm.json and water-saturated-properties.json, the second versions of those entries, and seeders/correlations/steam-saturated-properties.json)
"""
import json
import math
import os
import sys

from iapws import IAPWS95
from iapws.humidAir import Air

MAX_INTERPOLATION = 1e-3
P_ATM_MPA = 0.101325
OUT = os.path.join(os.path.dirname(__file__), '..', 'seeders', 'property-tables')
AIR = 'Lemmon, E. W., Jacobsen, R. T., Penoncello, S. G. & Friend, D. G. (2000) Thermodynamic properties of air and mixtures of nitrogen, argon and oxygen from 60 to 2000 K at pressures to 2000 MPa, J. Phys. Chem. Ref. Data 29:331-385; Lemmon, E. W. & Jacobsen, R. T. (2004) Viscosity and thermal conductivity equations for nitrogen, oxygen, argon and air, Int. J. Thermophys. 25:21-69'
WATER = 'IAPWS-95: Wagner, W. & Pruss, A. (2002) J. Phys. Chem. Ref. Data 31:387-535; viscosity: Huber, M. L. et al. (2009) J. Phys. Chem. Ref. Data 38:101-125 (IAPWS 2008); conductivity: Huber, M. L. et al. (2012) J. Phys. Chem. Ref. Data 41:033102 (IAPWS 2011)'


def air(t):
    a = Air(T=t, P=P_ATM_MPA)
    return {'rho': a.rho, 'cp': a.cp * 1000, 'mu': a.mu, 'nu': a.mu / a.rho, 'k': a.k, 'alpha': a.k / (a.rho * a.cp * 1000), 'Pr': a.mu * a.cp * 1000 / a.k}


def water(x):
    def props(t):
        w = IAPWS95(T=t, x=x)
        return {'p_sat': w.P * 1e6, 'rho': w.rho, 'cp': w.cp * 1000, 'mu': w.mu, 'nu': w.mu / w.rho, 'k': w.k, 'Pr': w.mu * w.cp * 1000 / w.k}
    return props


def grid(props, lo, hi, step, columns):
    """Rows at `step`, halved where a mid-point misses the formulation by more than MAX_INTERPOLATION."""
    first = math.floor(lo / step) * step + step
    ts = [lo] + [first + i * step for i in range(int((hi - first) / step)) if first + i * step < hi - 1e-9] + [hi]
    rows = {t: props(t) for t in ts}
    worst = 0.0
    changed = True
    while changed:
        changed = False
        ts = sorted(rows)
        for a, b in zip(ts, ts[1:]):
            mid = (a + b) / 2
            m = props(mid)
            err = max(abs((rows[a][c] + rows[b][c]) / 2 / m[c] - 1) for c in columns)
            if err > MAX_INTERPOLATION and b - a > 0.2:
                rows[round(mid, 4)] = m
                changed = True
    ts = sorted(rows)
    for a, b in zip(ts, ts[1:]):
        m = props((a + b) / 2)
        worst = max(worst, max(abs((rows[a][c] + rows[b][c]) / 2 / m[c] - 1) for c in columns))
    return ts, rows, worst


def sig(x, n=7):
    return float(f'{x:.{n}g}')


def table_entry(slug, title, summary, situation, tags, props, lo, hi, step, columns, units, names, source, prop_basis, notes, references, checks, validity_note, by_output, by_output_basis):
    ts, rows, worst = grid(props, lo, hi, step, columns)
    key = 'T'
    table = {
        'name': 'props', 'source': f'{source}. {len(ts)} rows, spacing refined until linear interpolation is within {worst * 100:.3f} % of the formulation at every mid-point.', 'key': key,
        'columns': [{'name': 'T', 'unit': 'K', 'values': [sig(t, 8) for t in ts]}] + [{'name': c, 'unit': units[c], 'values': [sig(rows[t][c]) for t in ts]} for c in columns],
    }
    steps = [{'kind': 'table', 'symbol': f'{c}_t', 'name': f'{c} from the table', 'unit': units[c], 'table': 'props', 'column': c, 'at': 'T'} for c in columns]
    outputs = [{'symbol': c, 'name': names[c], 'unit': units[c], 'expression': f'{c}_t'} for c in columns if c != 'p_sat']
    definition = {
        'schemaVersion': 1, 'title': title, 'summary': summary, 'category': 'properties', 'situation': situation, 'tags': tags,
        'inputs': [{'symbol': 'T', 'name': 'absolute temperature', 'unit': 'K'}], 'tables': [table], 'steps': steps, 'outputs': outputs,
        'validity': [{'symbol': 'T', 'min': lo, 'max': hi, 'note': validity_note}],
        'references': references, 'propertyBasis': prop_basis,
        'accuracy': {'rel': max(by_output.values()), 'byOutput': by_output, 'basis': f"{by_output_basis}; ν, α and Pr combine their factors as independent errors; linear interpolation adds at most {worst * 100:.2f} %"},
        'notes': notes,
    }
    check_cases = []
    for label, t in checks:
        p = props(t)
        check_cases.append({
            'label': label, 'inputs': {'T': t}, 'expected': {c: sig(p[c], 8) for c in columns if c != 'p_sat'},
            'tolerance': {'rel': 1.2e-3, 'why': 'linear interpolation between rows (at most 0.1 %, bounded when the table was generated) and 7-figure rounding'},
            'source': {'kind': 'standard-formulation', 'citation': f'{source}, computed with python3-iapws 1.5', 'locator': f'T = {t} K'},
        })
    return definition, check_cases, worst, len(ts)


def main():
    os.makedirs(OUT, exist_ok=True)
    air_def, air_cases, air_err, air_rows = table_entry(
        'air-properties-1atm', 'Dry air at one standard atmosphere, 200-1500 K (table)',
        'Density, specific heat, viscosity, kinematic viscosity, conductivity, diffusivity and Prandtl number of dry air at 101.325 kPa, interpolated linearly in temperature.',
        'air properties', ['air', 'property table', 'one atmosphere'], air, 200.0, 1500.0, 10.0,
        ['rho', 'cp', 'mu', 'nu', 'k', 'alpha', 'Pr'],
        {'rho': 'kg/m^3', 'cp': 'J/(kg K)', 'mu': 'Pa s', 'nu': 'm^2/s', 'k': 'W/(m K)', 'alpha': 'm^2/s', 'Pr': '1'},
        {'rho': 'density', 'cp': 'specific heat at constant pressure', 'mu': 'dynamic viscosity', 'nu': 'kinematic viscosity', 'k': 'thermal conductivity', 'alpha': 'thermal diffusivity', 'Pr': 'Prandtl number'},
        AIR, 'Dry air at 101.325 kPa. At other pressures scale ρ (and so ν, α) as p/101.325 kPa; μ, k, c_p and Pr barely depend on pressure at moderate pressure.',
        'Generated by scripts/property-tables.py from the standard formulations. Version 1 held a table transcribed from memory whose densities were those of 100 kPa (1.3 % low at one atmosphere).',
        [{'citation': AIR}],
        [('250.5 K, between rows', 250.5), ('300 K', 300.0), ('487.3 K, between rows', 487.3), ('823.7 K, between rows', 823.7), ('1333.3 K, between rows', 1333.3)],
        'range of the generated table (dry air, 101.325 kPa)',
        {'rho': 0.001, 'cp': 0.01, 'mu': 0.01, 'nu': 0.01, 'k': 0.02, 'alpha': 0.022, 'Pr': 0.025},
        'uncertainties the formulations state for the dilute gas (from memory of the papers; verify): density 0.1 % and heat capacity 1 % (Lemmon et al. 2000), viscosity 1 % and conductivity 2 % (Lemmon & Jacobsen 2004)')
    water_def, water_cases, water_err, water_rows = table_entry(
        'water-saturated-properties', 'Saturated liquid water, 273.16-600 K (table)',
        'Saturation pressure, density, specific heat, viscosity, kinematic viscosity, conductivity and Prandtl number of saturated liquid water, interpolated linearly in temperature.',
        'water properties', ['water', 'property table', 'saturated liquid'], water(0), 273.16, 600.0, 5.0,
        ['p_sat', 'rho', 'cp', 'mu', 'nu', 'k', 'Pr'],
        {'p_sat': 'Pa', 'rho': 'kg/m^3', 'cp': 'J/(kg K)', 'mu': 'Pa s', 'nu': 'm^2/s', 'k': 'W/(m K)', 'Pr': '1'},
        {'p_sat': 'saturation pressure', 'rho': 'density', 'cp': 'specific heat', 'mu': 'dynamic viscosity', 'nu': 'kinematic viscosity', 'k': 'thermal conductivity', 'Pr': 'Prandtl number'},
        WATER, 'Saturated liquid; pressure effects on the compressed liquid are small at moderate pressure.',
        'Generated by scripts/property-tables.py from IAPWS-95 and the IAPWS transport formulations. Version 1 held a 275-370 K table transcribed from memory (up to 1.7 % off in μ, 2.5 % in Pr).',
        [{'citation': WATER}],
        [('0.01 °C above the triple point', 273.17), ('20 °C', 293.15), ('61.7 °C, between rows', 334.85), ('180.3 °C, between rows', 453.45), ('322.2 °C, between rows', 595.35)],
        'range of the generated table (liquid at saturation)',
        {'p_sat': 0.0001, 'rho': 0.0001, 'cp': 0.001, 'mu': 0.01, 'nu': 0.01, 'k': 0.018, 'Pr': 0.021},
        'uncertainties the formulations state for the liquid (from memory of the papers; verify): density and saturation pressure below 0.01 %, heat capacity 0.1 % (IAPWS-95), viscosity 1 % (IAPWS 2008), conductivity 1.8 % (IAPWS 2011)')
    steam_def, steam_cases, steam_err, steam_rows = table_entry(
        'steam-saturated-properties', 'Saturated water vapour (steam), 273.16-600 K (table)',
        'Saturation pressure, density, specific heat, viscosity, kinematic viscosity, conductivity and Prandtl number of saturated water vapour, interpolated linearly in temperature.',
        'steam properties', ['steam', 'water vapour', 'property table', 'saturated vapour'], water(1), 273.16, 600.0, 5.0,
        ['p_sat', 'rho', 'cp', 'mu', 'nu', 'k', 'Pr'],
        {'p_sat': 'Pa', 'rho': 'kg/m^3', 'cp': 'J/(kg K)', 'mu': 'Pa s', 'nu': 'm^2/s', 'k': 'W/(m K)', 'Pr': '1'},
        {'p_sat': 'saturation pressure', 'rho': 'density', 'cp': 'specific heat', 'mu': 'dynamic viscosity', 'nu': 'kinematic viscosity', 'k': 'thermal conductivity', 'Pr': 'Prandtl number'},
        WATER, 'Saturated vapour at the saturation pressure of T.',
        'Generated by scripts/property-tables.py from IAPWS-95 and the IAPWS transport formulations.',
        [{'citation': WATER}],
        [('5 °C', 278.15), ('100 °C', 373.15), ('61.7 °C, between rows', 334.85), ('180.3 °C, between rows', 453.45), ('322.2 °C, between rows', 595.35)],
        'range of the generated table (vapour at saturation)',
        {'p_sat': 0.0001, 'rho': 0.001, 'cp': 0.002, 'mu': 0.01, 'nu': 0.01, 'k': 0.02, 'Pr': 0.023},
        'uncertainties the formulations state for the vapour (from memory of the papers; verify): density 0.1 % and heat capacity 0.2 % (IAPWS-95), viscosity 1 % (IAPWS 2008), conductivity 2 % (IAPWS 2011)')
    # Checks of another kind. Air and low-pressure steam are ideal gases to a fraction of a per cent
    # (compressibility Z within 0.3 % of 1: the ideal-gas-density correlation of the library).
    R, M_AIR, M_WATER = 8.314462618, 0.0289647, 0.01801528
    for t in (300.0, 1000.0):
        air_cases.append({'label': f'ideal-gas density at {t:g} K', 'inputs': {'T': t}, 'expected': {'rho': sig(101325 * M_AIR / (R * t), 8)},
                          'tolerance': {'rel': 3e-3, 'why': 'air at one atmosphere departs from the ideal gas by less than 0.3 % (Z) over 200-1500 K'},
                          'source': {'kind': 'cross-check', 'citation': 'ideal-gas-density (library), p M/(R_u T) with M = 28.9647 g/mol', 'locator': f'T = {t:g} K'}})
    for t in (278.15, 300.0):
        p_sat = water(1)(t)['p_sat']
        steam_cases.append({'label': f'ideal-gas density of the vapour at {t:g} K', 'inputs': {'T': t}, 'expected': {'rho': sig(p_sat * M_WATER / (R * t), 8)},
                            'tolerance': {'rel': 3e-3, 'why': 'water vapour below 4 kPa departs from the ideal gas by less than 0.1 %'},
                            'source': {'kind': 'cross-check', 'citation': 'ideal-gas-density (library) at the IAPWS-95 saturation pressure', 'locator': f'T = {t:g} K'}})
    water_cases.append({'label': 'density at 20 °C', 'inputs': {'T': 293.15}, 'expected': {'rho': 998.21}, 'tolerance': {'rel': 5e-4, 'why': 'recalled to five figures'},
                        'source': {'kind': 'memory', 'citation': 'density of pure water at 20 °C, 998.21 kg/m³ — value from memory', 'locator': '20 °C'}})
    water_cases.append({'label': 'viscosity at 20 °C', 'inputs': {'T': 293.15}, 'expected': {'mu': 1.0016e-3}, 'tolerance': {'rel': 2e-3, 'why': 'recalled to five figures'},
                        'source': {'kind': 'memory', 'citation': 'viscosity of water at 20 °C, 1.0016 mPa s — value from memory', 'locator': '20 °C'}})
    for slug, d, cases, lo, hi in [('air-properties-1atm', air_def, air_cases, 200.0, 1500.0), ('water-saturated-properties', water_def, water_cases, 273.16, 600.0), ('steam-saturated-properties', steam_def, steam_cases, 273.16, 600.0)]:
        cases.append({'label': 'beyond the table', 'inputs': {'T': hi + 20}, 'expected': {}, 'tolerance': {'rel': 1e-3, 'why': 'no value asserted, only the warning'},
                      'source': {'kind': 'common-practice', 'citation': 'validity range of the generated table'}, 'expectWarnings': ['T']})
        target = os.path.join(OUT if slug != 'steam-saturated-properties' else os.path.join(OUT, '..', 'correlations'), f'{slug}.json')
        with open(target, 'w') as f:
            json.dump({'slug': slug, 'definition': d, 'checkCases': cases}, f, indent=1, ensure_ascii=False)
            f.write('\n')
    print(f'air: {air_rows} rows, worst mid-point interpolation {air_err * 100:.4f} %; water: {water_rows} rows, {water_err * 100:.4f} %; steam: {steam_rows} rows, {steam_err * 100:.4f} %')


if __name__ == '__main__':
    sys.exit(main())
