import { checkExpression, ExpressionError, FUNCTIONS, BUILTIN_CONSTANTS, type CheckedExpression } from './expressions';
import { isOffsetUnit, parseUnit, isDimensionless } from './units';
import type { Definition, StepDef } from './types';

export type Stage = 'schema' | 'expressions' | 'symbols' | 'dimensions' | 'check-cases' | 'coverage';

export interface DefinitionIssue {
  stage: Stage;
  pointer: string;
  message: string;
}

export class DefinitionError extends Error {
  constructor(readonly issues: DefinitionIssue[]) {
    super(`The definition has ${issues.length} problem${issues.length === 1 ? '' : 's'}: ${issues.slice(0, 3).map((i) => `${i.pointer}: ${i.message}`).join('; ')}${issues.length > 3 ? '; …' : ''}`);
    this.name = 'DefinitionError';
  }
}

export type SymbolKind = 'input' | 'constant' | 'step' | 'output';

export interface Analysed {
  definition: Definition;
  /** Every symbol in evaluation order with its slot in the value array. */
  slots: Map<string, number>;
  kinds: Map<string, SymbolKind>;
  units: Map<string, string>;
  steps: { step: StepDef; pointer: string; checked: CheckedExpression[] }[];
  outputs: { symbol: string; pointer: string; checked: CheckedExpression }[];
}

/**
 * Symbol, expression-safety and unit-declaration checks of a schema-valid definition. Collects
 * every problem it can rather than stopping at the first.
 */
export function analyseDefinition(def: Definition): { analysed?: Analysed; issues: DefinitionIssue[] } {
  const issues: DefinitionIssue[] = [];
  const slots = new Map<string, number>();
  const kinds = new Map<string, SymbolKind>();
  const units = new Map<string, string>();
  const declare = (symbol: string, kind: SymbolKind, unit: string, pointer: string) => {
    if (slots.has(symbol)) {
      issues.push({ stage: 'symbols', pointer: `${pointer}/symbol`, message: `"${symbol}" is already declared as ${kinds.get(symbol) === 'input' ? 'an' : 'a'} ${kinds.get(symbol)}` });
      return;
    }
    if (Object.hasOwn(FUNCTIONS, symbol) || Object.hasOwn(BUILTIN_CONSTANTS, symbol)) {
      issues.push({ stage: 'symbols', pointer: `${pointer}/symbol`, message: `"${symbol}" is a reserved name (a function or built-in constant); choose another symbol` });
      return;
    }
    try {
      if (isOffsetUnit(unit)) {
        issues.push({ stage: 'dimensions', pointer: `${pointer}/unit`, message: `declare temperatures in K, not "${unit}"; callers may still send { "value": …, "unit": "degC" }` });
      } else if (!isDimensionless(unit)) parseUnit(unit);
    } catch (err) {
      issues.push({ stage: 'dimensions', pointer: `${pointer}/unit`, message: (err as Error).message });
    }
    slots.set(symbol, slots.size);
    kinds.set(symbol, kind);
    units.set(symbol, unit);
  };
  const check = (source: string, pointer: string, extra?: string): CheckedExpression | null => {
    const visible = new Set(slots.keys());
    if (extra) visible.add(extra);
    try {
      return checkExpression(source, visible);
    } catch (err) {
      if (!(err instanceof ExpressionError)) throw err;
      const later = err.unknownSymbol !== undefined && [...(def.steps ?? []), ...def.outputs].some((s) => s.symbol === err.unknownSymbol);
      issues.push({
        stage: err.unknownSymbol ? 'symbols' : 'expressions',
        pointer,
        message: later ? `"${err.unknownSymbol}" is defined later; a step may only use inputs, constants and the steps before it` : err.message,
      });
      return null;
    }
  };

  def.inputs.forEach((inp, i) => declare(inp.symbol, 'input', inp.unit, `/inputs/${i}`));
  (def.constants ?? []).forEach((c, i) => declare(c.symbol, 'constant', c.unit, `/constants/${i}`));

  const tables = new Map((def.tables ?? []).map((t) => [t.name, t]));
  (def.tables ?? []).forEach((t, ti) => {
    const key = t.columns.find((c) => c.name === t.key);
    if (!key) issues.push({ stage: 'symbols', pointer: `/tables/${ti}/key`, message: `the key column "${t.key}" is not one of the table's columns` });
    const n = t.columns[0]?.values.length ?? 0;
    t.columns.forEach((c, ci) => {
      if (c.values.length !== n) issues.push({ stage: 'symbols', pointer: `/tables/${ti}/columns/${ci}/values`, message: `has ${c.values.length} values but the first column has ${n}` });
    });
    if (key && key.values.some((x, i) => i > 0 && !(x > key.values[i - 1]))) {
      issues.push({ stage: 'symbols', pointer: `/tables/${ti}/columns/${t.columns.indexOf(key)}/values`, message: `the key column "${t.key}" must be strictly increasing` });
    }
  });

  const steps: Analysed['steps'] = [];
  (def.steps ?? []).forEach((step, i) => {
    const pointer = `/steps/${i}`;
    const checked: CheckedExpression[] = [];
    if (step.kind === 'expression') {
      const c = check(step.expression, `${pointer}/expression`);
      if (c) checked.push(c);
    } else if (step.kind === 'solve') {
      const c = check(step.residual, `${pointer}/residual`, step.symbol);
      if (c) checked.push(c);
      if (c && !c.symbols.includes(step.symbol)) {
        issues.push({ stage: 'symbols', pointer: `${pointer}/residual`, message: `the residual must contain the unknown "${step.symbol}"` });
      }
      step.bracket.forEach((b, bi) => {
        const cb = check(String(b), `${pointer}/bracket/${bi}`);
        if (cb) checked.push(cb);
      });
    } else {
      const t = tables.get(step.table);
      if (!t) issues.push({ stage: 'symbols', pointer: `${pointer}/table`, message: `no table named "${step.table}" in "tables"` });
      else if (!t.columns.some((c) => c.name === step.column)) issues.push({ stage: 'symbols', pointer: `${pointer}/column`, message: `table "${step.table}" has no column "${step.column}"` });
      if (!slots.has(step.at)) issues.push({ stage: 'symbols', pointer: `${pointer}/at`, message: `"${step.at}" must be an input or an earlier step` });
    }
    declare(step.symbol, 'step', step.unit, pointer);
    steps.push({ step, pointer, checked });
  });

  const outputs: Analysed['outputs'] = [];
  def.outputs.forEach((out, i) => {
    const pointer = `/outputs/${i}`;
    const c = check(out.expression, `${pointer}/expression`);
    declare(out.symbol, 'output', out.unit, pointer);
    if (c) outputs.push({ symbol: out.symbol, pointer, checked: c });
  });

  (def.validity ?? []).forEach((lim, i) => {
    const pointer = `/validity/${i}`;
    if (!slots.has(lim.symbol)) issues.push({ stage: 'symbols', pointer: `${pointer}/symbol`, message: `"${lim.symbol}" is not an input, step or output of this definition` });
    else if (kinds.get(lim.symbol) === 'constant') issues.push({ stage: 'symbols', pointer: `${pointer}/symbol`, message: `"${lim.symbol}" is a constant; limits belong on inputs, steps or outputs` });
    if (lim.min !== undefined && lim.max !== undefined && !(lim.min < lim.max)) {
      issues.push({ stage: 'symbols', pointer, message: `min (${lim.min}) must be less than max (${lim.max})` });
    }
  });

  return issues.length ? { issues } : { analysed: { definition: def, slots, kinds, units, steps, outputs }, issues };
}
