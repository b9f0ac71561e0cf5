/** Units a person may pick for an input or an output, by its declared unit (conversion happens on the server). */
const FAMILIES: string[][] = [
  ['K', 'degC', 'degF'],
  ['m', 'mm', 'cm', 'km', 'inch', 'ft'],
  ['Pa', 'kPa', 'MPa', 'bar', 'atm', 'psi'],
  ['Pa s', 'mPa s'],
  ['m^2/s', 'mm^2/s'],
  ['W/(m K)', 'BTU/(hr ft degF)'],
  ['W/(m^2 K)', 'BTU/(hr ft^2 degF)'],
  ['W/m^2', 'kW/m^2', 'BTU/(hr ft^2)'],
  ['W', 'kW', 'BTU/hr'],
  ['kg/s', 'kg/h', 'lb/hr'],
  ['m^2 K/W', 'hr ft^2 degF/BTU'],
  ['kg/m^3', 'g/cm^3', 'lb/ft^3'],
  ['m/s', 'km/h', 'ft/s'],
  ['J/(kg K)', 'kJ/(kg K)'],
  ['kg/mol', 'g/mol'],
];

export function unitChoices(declared: string): string[] {
  const family = FAMILIES.find((f) => f.includes(declared));
  return family ? [declared, ...family.filter((u) => u !== declared)] : [declared];
}

export function isDimensionless(u: string): boolean {
  return ['1', '', '-', 'dimensionless'].includes(u.trim());
}

export function formatNumber(x: number | null | undefined, digits = 5): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return '—';
  const a = Math.abs(x);
  if (a !== 0 && (a >= 1e6 || a < 1e-3)) return x.toExponential(digits - 1).replace(/\.?0+e/, 'e');
  return Number(x.toPrecision(digits)).toString();
}
