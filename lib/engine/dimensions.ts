import type { Unit } from 'mathjs';
import type { Analysed, DefinitionIssue } from './analyse';
import { typicalValue } from './ranges';
import { describeDimension, hasDimensionOf, isDimensionless, parseUnit, quantity } from './units';
import { FUNCTIONS } from './expressions';

/**
 * Evaluates every step and output with units (mathjs quantities) and reports each expression whose
 * dimension disagrees with its declared unit, or that combines incompatible dimensions.
 */
export function checkDimensions(a: Analysed): DefinitionIssue[] {
  const issues: DefinitionIssue[] = [];
  const scope = new Map<string, unknown>();
  const bad = new Set<string>();
  for (const inp of a.definition.inputs) scope.set(inp.symbol, quantity(typicalValue(a.definition, inp.symbol), inp.unit));
  for (const c of a.definition.constants ?? []) scope.set(c.symbol, quantity(c.value === 0 ? 1 : c.value, c.unit));
  // Whitelisted functions mathjs does not know (the Bessel functions) take and give pure numbers.
  for (const name of ['besselI0', 'besselI1', 'besselK0', 'besselK1']) {
    scope.set(name, (x: unknown) => {
      if (typeof x !== 'number' && !(x as Unit).dimensions.every((d) => d === 0)) throw new Error(`${name} acts on a quantity that has a dimension`);
      return FUNCTIONS[name].impl(toNumber(x));
    });
  }

  const evaluateWithUnits = (node: { compile(): { evaluate(scope: Map<string, unknown>): unknown } }) => node.compile().evaluate(scope);
  const expect = (value: unknown, unitText: string, symbol: string, pointer: string) => {
    if (!hasDimensionOf(value, unitText)) {
      issues.push({ stage: 'dimensions', pointer, message: `${symbol} has dimension ${describeDimension(value)} but is declared ${isDimensionless(unitText) ? 'dimensionless (1)' : unitText}` });
    }
  };
  const failed = (err: unknown, pointer: string, symbol: string) => {
    bad.add(symbol);
    const raw = (err as Error).message;
    const why = /addScalar|subtractScalar|Units do not match|compare|larger|smaller|equalScalar/i.test(raw)
      ? 'it adds, subtracts or compares quantities of different dimensions'
      : /log|exp|sin|cos|tan|pow|bessel/i.test(raw)
        ? 'a logarithm, exponential, trigonometric or Bessel function or an exponent acts on a quantity that has a dimension'
        : raw;
    issues.push({ stage: 'dimensions', pointer, message: `the units of ${symbol} do not work out: ${why}. Make each term a dimensionless group or a quantity in consistent units.` });
  };
  const uses = (symbols: string[]) => symbols.some((s) => bad.has(s));

  for (const { step, pointer, checked } of a.steps) {
    try {
      if (step.kind === 'expression') {
        if (uses(checked[0].symbols)) { bad.add(step.symbol); continue; }
        const value = evaluateWithUnits(checked[0].node);
        expect(value, step.unit, step.symbol, `${pointer}/expression`);
        scope.set(step.symbol, typeof value === 'number' || isDimensionless(step.unit) ? toNumber(value) : value);
      } else if (step.kind === 'solve') {
        const lo = evaluateWithUnits(checked[1].node);
        const hi = evaluateWithUnits(checked[2].node);
        expect(lo, step.unit, `${step.symbol} (bracket start)`, `${pointer}/bracket/0`);
        expect(hi, step.unit, `${step.symbol} (bracket end)`, `${pointer}/bracket/1`);
        const mid = (toNumber(lo) + toNumber(hi)) / 2;
        scope.set(step.symbol, quantity(mid, step.unit));
        try {
          evaluateWithUnits(checked[0].node);
        } catch (err) {
          failed(err, `${pointer}/residual`, step.symbol);
        }
      } else {
        const table = a.definition.tables?.find((t) => t.name === step.table);
        const key = table?.columns.find((c) => c.name === table.key);
        const col = table?.columns.find((c) => c.name === step.column);
        const atUnit = a.units.get(step.at) ?? '1';
        if (key && !sameDimension(key.unit, atUnit)) {
          issues.push({ stage: 'dimensions', pointer: `${pointer}/at`, message: `${step.at} is declared ${atUnit} but table "${step.table}" is keyed by ${key.name} in ${key.unit}` });
        }
        if (col && !sameDimension(col.unit, step.unit)) {
          issues.push({ stage: 'dimensions', pointer: `${pointer}/unit`, message: `${step.symbol} is declared ${step.unit} but column "${col.name}" is in ${col.unit}` });
        }
        scope.set(step.symbol, quantity(col?.values[0] || 1, step.unit));
      }
    } catch (err) {
      failed(err, step.kind === 'expression' ? `${pointer}/expression` : pointer, step.symbol);
    }
  }
  for (const out of a.outputs) {
    if (uses(out.checked.symbols)) continue;
    const decl = a.definition.outputs.find((o) => o.symbol === out.symbol)!;
    try {
      const value = evaluateWithUnits(out.checked.node);
      expect(value, decl.unit, out.symbol, `${out.pointer}/expression`);
      scope.set(out.symbol, value);
    } catch (err) {
      failed(err, `${out.pointer}/expression`, out.symbol);
    }
  }
  return issues;
}

function toNumber(v: unknown): number {
  if (typeof v === 'number') return v;
  const u = v as Unit;
  return u.dimensions.every((d) => d === 0) ? (u.value as number) : u.toSI().toNumber();
}

/** True when two declared units have the same dimension (both dimensionless counts). */
export function sameDimension(a: string, b: string): boolean {
  if (isDimensionless(a) || isDimensionless(b)) return isDimensionless(a) && isDimensionless(b);
  try {
    return parseUnit(a).equalBase(parseUnit(b));
  } catch {
    return false;
  }
}

