import { FUNCTION_IMPLS, toJs } from './expressions';
import { brent, interpolate, NoRootError } from './solve';
import { convert, isDimensionless } from './units';
import { analyseDefinition, DefinitionError, type Analysed } from './analyse';
import { checkDefinitionSchema } from './schema';
import { canonicalJson, sha256Hex } from './canonical';
import type { Definition, EvaluationResult, InputDef, InputValue, ValidityLimit, Warning } from './types';

/** A limit as the evaluator checks it; table ranges become limits too. */
export interface CompiledLimit {
  symbol: string;
  min?: number;
  max?: number;
  minInclusive: boolean;
  maxInclusive: boolean;
  action: 'warn' | 'refuse';
  note?: string;
}

export class EvaluationError extends Error {
  constructor(readonly code: 'refused' | 'no-root' | 'not-finite', message: string, readonly symbol?: string, readonly warnings: Warning[] = []) {
    super(message);
    this.name = 'EvaluationError';
  }
}

export interface InputIssue {
  path: string;
  message: string;
}

export class InputError extends Error {
  constructor(readonly issues: InputIssue[]) {
    super(issues.map((i) => `${i.path}: ${i.message}`).join('; '));
    this.name = 'InputError';
  }
}

export interface CompiledDefinition {
  hash: string;
  definition: Definition;
  analysed: Analysed;
  inputSymbols: string[];
  outputSymbols: string[];
  limits: CompiledLimit[];
  /** Evaluation on plain numbers in declared units (the fast path). */
  run(values: ArrayLike<number>): EvaluationResult;
  /**
   * Batch evaluation on a flat array of rows (inputs in declared order), reusing one work array:
   * outputs come back flat in declared order; rows with warnings or errors are listed sparsely.
   */
  runMany(rows: Float64Array, count: number): { outputs: Float64Array; warnings: Map<number, Warning[]>; errors: Map<number, EvaluationError> };
  /** Evaluation from API-style inputs: numbers in declared units or { value, unit }. */
  evaluate(inputs: Record<string, unknown>): EvaluationResult;
  /**
   * The bare evaluator for callers that chain definitions (lib/engine/chain.ts): `v` holds nSlots
   * numbers with the inputs (declared units, declared order) first; afterwards the outputs sit at
   * outputSlots. `W(limitIndex, value)` is called for each limit broken; it may throw to refuse.
   */
  exec(v: Float64Array, W: (limitIndex: number, value: number) => void): void;
  nSlots: number;
  outputSlots: number[];
  /** Estimated work of one row, in expression-tree nodes evaluated (an implicit solve counts SOLVE_ITERATIONS times). */
  rowCost: number;
  /** Steps and outputs evaluated per row: what the rate limit counts. */
  stepsPerRow: number;
  /** Turns API-style inputs into numbers in declared units; `path` prefixes error paths. */
  readInputs(inputs: unknown, path: string): Float64Array;
  /** The generated JavaScript, for inspection and tests. */
  source: string;
}

type WarnFn = (limit: number, value: number) => void;
type RunFn = (v: Float64Array, W: WarnFn) => void;
/**
 * Runs rows from `at[0]` on; `at[0]` always holds the row being computed (so W and a thrown error can be filed under
 * it). Returns `count` when done, or the first row whose outputs are not finite (not written).
 */
type ManyFn = (rows: Float64Array, count: number, out: Float64Array, W: WarnFn, at: Int32Array) => number;

/**
 * Turns the generated lines into two functions: run(v, W) for one row in the slot array v, and many(…) for a table of
 * rows. The lines hold only numbers, v[i] slots, and calls to F.<whitelisted name>, S (solve), T (table) and W (warn),
 * generated from the checked tree. While a row is computed its slots are local variables (registers, not memory);
 * each function used is bound once to a constant of the enclosing factory, so the hot loop calls it directly and V8
 * inlines the Math built-ins as in hand-written code. A row that raises no warning costs no more than its formula.
 */
function buildRunner(lines: string[], tableData: Float64Array[], nInputs: number, nSlots: number, outputSlots: number[]): { run: RunFn; many: ManyFn; source: string } {
  const body = lines.join('\n');
  const used = [...new Set([...body.matchAll(/\bF\.([A-Za-z0-9_]+)\(/g)].map((m) => m[1]))];
  for (const name of used) if (!Object.hasOwn(FUNCTION_IMPLS, name)) throw new Error(`generated code calls an unknown function ${name}`);
  const locals = used.map((name) => `const F_${name} = F.${name};`).join(' ');
  const code = body.replace(/\bF\.([A-Za-z0-9_]+)\(/g, 'F_$1(').replace(/\bv\[(\d+)\]/g, 's$1');
  const declare = (from: (i: number) => string) => `let ${Array.from({ length: nSlots }, (_, i) => `s${i} = ${i < nInputs ? from(i) : '0'}`).join(', ')};`;
  const writeBack = Array.from({ length: nSlots - nInputs }, (_, j) => `v[${nInputs + j}] = s${nInputs + j};`).join(' ');
  const nOut = outputSlots.length;
  const finite = outputSlots.map((k) => `Number.isFinite(s${k})`).join(' && ');
  const store = outputSlots.map((k, i) => `out[o + ${i}] = s${k};`).join(' ');
  const source = `"use strict"; ${locals}
function run(v, W) {
${declare((i) => `v[${i}]`)}
${code}
${writeBack}
}
function many(rows, count, out, W, at) {
for (let r = at[0]; r < count; r++) {
at[0] = r;
const b = r * ${nInputs}, o = r * ${nOut};
${declare((i) => `rows[b + ${i}]`)}
${code}
if (!(${finite})) return r;
${store}
}
at[0] = count;
return count;
}
return { run, many };`;
  const factory = new Function('F', 'S', 'T', 'D', source) as (F: unknown, S: typeof solveStep, T: typeof tableStep, D: Float64Array[]) => { run: RunFn; many: ManyFn };
  return { ...factory(FUNCTION_IMPLS, solveStep, tableStep, tableData), source };
}

function solveStep(f: (x: number) => number, lo: number, hi: number, symbol: string): number {
  try {
    return brent(f, lo, hi);
  } catch (err) {
    if (err instanceof NoRootError) throw new EvaluationError('no-root', `solving for ${symbol}: ${err.message}`, symbol);
    throw err;
  }
}

function tableStep(xs: Float64Array, ys: Float64Array, x: number): number {
  return interpolate(xs, ys, x);
}

function limitCheck(slot: number, index: number, lim: CompiledLimit): string {
  const parts: string[] = [];
  if (lim.min !== undefined) parts.push(`v[${slot}] ${lim.minInclusive ? '<' : '<='} ${lim.min}`);
  if (lim.max !== undefined) parts.push(`v[${slot}] ${lim.maxInclusive ? '>' : '>='} ${lim.max}`);
  return `if (${parts.join(' || ')}) W(${index}, v[${slot}]);`;
}

function fmt(x: number): string {
  if (x === 0) return '0';
  const a = Math.abs(x);
  return a >= 1e5 || a < 1e-3 ? x.toExponential(3).replace(/\.?0+e/, 'e') : String(Number(x.toPrecision(6)));
}

export function limitMessage(lim: CompiledLimit, value: number): string {
  const below = lim.min !== undefined && (lim.minInclusive ? value < lim.min : value <= lim.min);
  const bound = below ? lim.min! : lim.max!;
  const word = below ? (lim.minInclusive ? 'below the minimum' : 'at or below the exclusive minimum') : (lim.maxInclusive ? 'above the maximum' : 'at or above the exclusive maximum');
  const range = `${lim.min !== undefined ? fmt(lim.min) : '−∞'} … ${lim.max !== undefined ? fmt(lim.max) : '∞'}`;
  const what = lim.note?.startsWith('table:') ? `outside the tabulated range (${range}); value extrapolated linearly` : `${word} ${fmt(bound)} of the published validity range (${range})`;
  return `${lim.symbol} = ${fmt(value)} is ${what}${lim.note && !lim.note.startsWith('table:') ? ` — ${lim.note}` : ''}`;
}

/**
 * Why an output has no value. A broken validity limit usually is the cause: name it first
 * ("Re_D = -5 is below the minimum 0 …"), then the formula's NaN or Infinity.
 */
export function notFiniteMessage(symbol: string, value: number, warnings: Warning[]): string {
  const cause = warnings.length ? `${warnings.map((w) => w.message).join('; ')}. ` : '';
  return `${cause}${symbol} cannot be computed for these inputs (the formula gives ${value})${cause ? '' : '; check them against the validity ranges'}`;
}

/** A limit's warning for a value (the message names the symbol, the value and the published bound). */
export function warningOf(lim: CompiledLimit, value: number): Warning {
  const w: Warning = { symbol: lim.symbol, value, message: limitMessage(lim, value) };
  if (lim.min !== undefined) w.min = lim.min;
  if (lim.max !== undefined) w.max = lim.max;
  return w;
}

/** True when `value` breaks the limit (NaN breaks every limit). */
export function breaks(lim: CompiledLimit, value: number): boolean {
  if (lim.min !== undefined && !(lim.minInclusive ? value >= lim.min : value > lim.min)) return true;
  if (lim.max !== undefined && !(lim.maxInclusive ? value <= lim.max : value < lim.max)) return true;
  return false;
}

export function compileLimits(validity: ValidityLimit[] | undefined): CompiledLimit[] {
  return (validity ?? []).map((l) => ({
    symbol: l.symbol, min: l.min, max: l.max, minInclusive: l.minInclusive ?? true, maxInclusive: l.maxInclusive ?? true,
    action: l.action ?? 'warn', note: l.note,
  }));
}

/**
 * Turns API-style inputs (numbers in declared units, or { value, unit }) into numbers in the
 * declared units, in declared order; every problem is reported with its path.
 */
export function readInputValues(declared: InputDef[], inputs: unknown, path: string): Float64Array {
  const symbols = declared.map((d) => d.symbol);
  const issues: InputIssue[] = [];
  const values = new Float64Array(declared.length);
  if (!inputs || typeof inputs !== 'object' || Array.isArray(inputs)) {
    throw new InputError([{ path, message: `must be an object with the inputs ${symbols.join(', ')}` }]);
  }
  const given = inputs as Record<string, unknown>;
  let unknown = 0;
  for (const key of Object.keys(given)) {
    // Bounded: a body with thousands of unknown keys gets a few messages and a count, not thousands.
    if (!symbols.includes(key) && unknown++ < 5) issues.push({ path: `${path}.${key}`, message: `unknown input; this takes ${symbols.join(', ')}` });
  }
  if (unknown > 5) issues.push({ path, message: `${unknown - 5} more unknown inputs not listed` });
  declared.forEach(({ symbol, unit: declaredUnit }, i) => {
    const raw = Object.hasOwn(given, symbol) ? given[symbol] : undefined;
    const p = `${path}.${symbol}`;
    if (raw === undefined || raw === null) { issues.push({ path: p, message: 'is missing' }); return; }
    let value: number;
    if (typeof raw === 'number') value = raw;
    else if (typeof raw === 'object' && !Array.isArray(raw) && 'value' in raw) {
      const { value: v, unit } = raw as { value: unknown; unit?: unknown };
      if (typeof v !== 'number' || !Number.isFinite(v)) { issues.push({ path: `${p}.value`, message: 'must be a finite number' }); return; }
      if (unit === undefined || unit === null || unit === '') value = v;
      else if (typeof unit !== 'string' || unit.length > 60) { issues.push({ path: `${p}.unit`, message: 'must be a unit string such as "degC"' }); return; }
      else {
        try {
          value = convert(v, unit, declaredUnit);
        } catch (err) {
          issues.push({ path: `${p}.unit`, message: `${(err as Error).message}; ${symbol} is declared in ${isDimensionless(declaredUnit) ? 'no unit (dimensionless)' : `"${declaredUnit}"`}` });
          return;
        }
      }
    } else { issues.push({ path: p, message: 'must be a number or { "value": number, "unit": string }' }); return; }
    if (!Number.isFinite(value)) { issues.push({ path: p, message: 'must be a finite number (not NaN or Infinity)' }); return; }
    values[i] = value;
  });
  if (issues.length) throw new InputError(issues);
  return values;
}

/** Compiles a definition (schema-checked, analysed) into a fast evaluator over plain numbers. */
/** Brent's method typically converges in well under this many residual evaluations (cost estimate only). */
export const SOLVE_ITERATIONS = 40;
/** Largest estimated work of one row a definition may have: the complexity cap checked at validation. */
export const MAX_ROW_COST = 50_000;

/** Estimated work of one row of an analysed definition (see rowCost). */
export function rowCostOf(analysed: Analysed): number {
  let cost = 0;
  for (const { step, checked } of analysed.steps) {
    if (step.kind === 'solve') cost += SOLVE_ITERATIONS * (checked[0]?.nodes ?? 1) + (checked[1]?.nodes ?? 1) + (checked[2]?.nodes ?? 1);
    else if (step.kind === 'table') cost += 8;
    else cost += checked[0]?.nodes ?? 1;
  }
  for (const out of analysed.outputs) cost += out.checked.nodes;
  return cost + analysed.definition.inputs.length;
}

export function compileDefinition(definition: Definition): CompiledDefinition {
  const schemaIssues = checkDefinitionSchema(definition);
  if (schemaIssues.length) throw new DefinitionError(schemaIssues.map((i) => ({ stage: 'schema', ...i })));
  const { analysed, issues } = analyseDefinition(definition);
  if (!analysed) throw new DefinitionError(issues);
  const { slots } = analysed;
  const slot = (s: string) => slots.get(s)!;

  const limits = compileLimits(definition.validity);
  const limitsOf = (symbol: string) => limits.map((l, i) => [l, i] as const).filter(([l]) => l.symbol === symbol);

  const tableData: Float64Array[] = [];
  const lines: string[] = [];
  for (const inp of definition.inputs) for (const [l, i] of limitsOf(inp.symbol)) lines.push(limitCheck(slot(inp.symbol), i, l));
  for (const c of definition.constants ?? []) lines.push(`v[${slot(c.symbol)}] = ${c.value};`);
  for (const { step, checked } of analysed.steps) {
    const k = slot(step.symbol);
    if (step.kind === 'expression') {
      lines.push(`v[${k}] = ${toJs(checked[0].node, slots)};`);
    } else if (step.kind === 'solve') {
      const [res, lo, hi] = checked.map((c) => toJs(c.node, slots));
      lines.push(`v[${k}] = S((x) => { v[${k}] = x; return ${res}; }, ${lo}, ${hi}, ${JSON.stringify(step.symbol)});`);
    } else {
      const table = definition.tables!.find((t) => t.name === step.table)!;
      const xs = Float64Array.from(table.columns.find((c) => c.name === table.key)!.values);
      const ys = Float64Array.from(table.columns.find((c) => c.name === step.column)!.values);
      tableData.push(xs, ys);
      const tableLimit: CompiledLimit = { symbol: step.at, min: xs[0], max: xs[xs.length - 1], minInclusive: true, maxInclusive: true, action: 'warn', note: `table:${table.name}` };
      // A published range inside the table already warns; a second warning for the same value would be noise.
      const covered = limits.some((l) => l.symbol === step.at && !l.note?.startsWith('table:') && l.min !== undefined && l.max !== undefined && l.min >= xs[0] && l.max <= xs[xs.length - 1]);
      const already = limits.findIndex((l) => l.symbol === step.at && l.note === tableLimit.note);
      if (!covered && already < 0) lines.push(limitCheck(slot(step.at), limits.push(tableLimit) - 1, tableLimit));
      lines.push(`v[${k}] = T(D[${tableData.length - 2}], D[${tableData.length - 1}], v[${slot(step.at)}]);`);
    }
    for (const [l, i] of limitsOf(step.symbol)) lines.push(limitCheck(k, i, l));
  }
  for (const out of analysed.outputs) {
    const k = slot(out.symbol);
    lines.push(`v[${k}] = ${toJs(out.checked.node, slots)};`);
    for (const [l, i] of limitsOf(out.symbol)) lines.push(limitCheck(k, i, l));
  }

  const inputSymbols = definition.inputs.map((i) => i.symbol);
  const outputSymbols = definition.outputs.map((o) => o.symbol);
  const outputSlots = outputSymbols.map(slot);
  const nSlots = slots.size;
  const { run, many, source } = buildRunner(lines, tableData, inputSymbols.length, nSlots, outputSlots);

  const runMany = (rows: Float64Array, count: number) => {
    const nOut = outputSymbols.length;
    const outputs = new Float64Array(count * nOut);
    const warningsByRow = new Map<number, Warning[]>();
    const errors = new Map<number, EvaluationError>();
    const at = new Int32Array(1);
    // Warnings are rare: W files them under the current row directly.
    const W: WarnFn = (index, value) => {
      const lim = limits[index];
      const w = warningOf(lim, value);
      let list = warningsByRow.get(at[0]);
      if (lim.action === 'refuse') throw new EvaluationError('refused', `${w.message}. This limit is marked hard: no result is given.`, lim.symbol, [...(list ?? []), w]);
      if (!list) warningsByRow.set(at[0], (list = []));
      list.push(w);
    };
    const refuse = (row: number, err: EvaluationError) => {
      errors.set(row, err);
      outputs.fill(NaN, row * nOut, (row + 1) * nOut);
      at[0] = row + 1;
    };
    // The generated loop runs until it finishes, a row throws (a hard limit, no root) or a row's outputs are not
    // finite; that row is recorded and the loop resumes after it.
    while (at[0] < count) {
      let stopped: number;
      try {
        stopped = many(rows, count, outputs, W, at);
      } catch (err) {
        if (!(err instanceof EvaluationError)) throw err;
        refuse(at[0], err);
        continue;
      }
      if (stopped >= count) break;
      // Which output is not finite, and what the row's warnings say about why: run it once more, alone.
      const v = new Float64Array(nSlots);
      v.set(rows.subarray(stopped * inputSymbols.length, (stopped + 1) * inputSymbols.length));
      run(v, () => undefined);
      const i = outputSlots.findIndex((k) => !Number.isFinite(v[k]));
      const warnings = warningsByRow.get(stopped) ?? [];
      refuse(stopped, new EvaluationError('not-finite', notFiniteMessage(outputSymbols[i], v[outputSlots[i]], warnings), outputSymbols[i], warnings));
    }
    return { outputs, warnings: warningsByRow, errors };
  };

  const runValues = (values: ArrayLike<number>): EvaluationResult => {
    const v = new Float64Array(nSlots);
    for (let i = 0; i < inputSymbols.length; i++) v[i] = values[i];
    const warnings: Warning[] = [];
    const W: WarnFn = (index, value) => {
      const lim = limits[index];
      const w = warningOf(lim, value);
      if (lim.action === 'refuse') {
        throw new EvaluationError('refused', `${w.message}. This limit is marked hard: no result is given.`, lim.symbol, [...warnings, w]);
      }
      warnings.push(w);
    };
    run(v, W);
    const outputs: Record<string, number> = {};
    for (let i = 0; i < outputSymbols.length; i++) {
      const value = v[outputSlots[i]];
      if (!Number.isFinite(value)) {
        throw new EvaluationError('not-finite', notFiniteMessage(outputSymbols[i], value, warnings), outputSymbols[i], warnings);
      }
      outputs[outputSymbols[i]] = value;
    }
    return { outputs, warnings };
  };

  const readInputs = (inputs: unknown, path: string) => readInputValues(definition.inputs, inputs, path);

  return {
    hash: sha256Hex(canonicalJson(definition)),
    definition,
    analysed,
    inputSymbols,
    outputSymbols,
    limits,
    run: runValues,
    runMany,
    readInputs,
    evaluate: (inputs) => runValues(readInputs(inputs, 'inputs')),
    exec: run,
    nSlots,
    outputSlots,
    rowCost: rowCostOf(analysed),
    stepsPerRow: (definition.steps?.length ?? 0) + definition.outputs.length,
    source,
  };
}

const cache = new Map<string, CompiledDefinition>();
const CACHE_SIZE = 500;

/** Compiled evaluator for a definition, cached by the hash of its canonical JSON. */
export function compiled(definition: Definition, knownHash?: string): CompiledDefinition {
  const key = knownHash ?? sha256Hex(canonicalJson(definition));
  let hit = cache.get(key);
  if (hit) {
    cache.delete(key);
    cache.set(key, hit);
    return hit;
  }
  hit = compileDefinition(definition);
  cache.set(key, hit);
  if (cache.size > CACHE_SIZE) cache.delete(cache.keys().next().value!);
  return hit;
}

/**
 * Compiled evaluator looked up by a known key (a frozen version's content hash); the definition is
 * produced (parsed) only on a miss, which keeps JSON parsing off the hot path.
 */
export function compiledByKey(key: string, load: () => Definition): CompiledDefinition {
  const hit = cache.get(key);
  if (hit) return hit;
  const c = compileDefinition(load());
  cache.set(key, c);
  if (cache.size > CACHE_SIZE) cache.delete(cache.keys().next().value!);
  return c;
}

export type { InputValue };
