import { checkCheckCaseSchema, checkDefinitionSchema, checkTemplateSchema } from './schema';
import { analyseDefinition, DefinitionError, type DefinitionIssue, type Stage } from './analyse';
import { checkDimensions } from './dimensions';
import { compiled, EvaluationError, InputError, MAX_ROW_COST, rowCostOf, SOLVE_ITERATIONS, type CompiledDefinition } from './compile';
import { compileChain, type Resolve } from './chain';
import type { CheckCase, Definition, InputDef, Warning } from './types';
import type { TemplateDefinition } from './template-types';
import { DEFAULT_POLICY, evidenceOf, type Evidence, type EvidencePolicy } from './evidence';
import { boundsAmong, isLogRange } from './ranges';

/** What running check cases needs of an evaluator: a compiled correlation or a compiled chain. */
type Evaluator = Pick<CompiledDefinition, 'outputSymbols' | 'limits' | 'evaluate' | 'readInputs'> & { definition: { inputs: InputDef[] } };

export const ENGINE_VERSION = '1.0.0';
export const REPORT_FORMAT = 2;

export interface CaseResult {
  index: number;
  label: string;
  passed: boolean;
  sourceKind: string;
  citation: string;
  locator?: string;
  outputs: { symbol: string; computed: number | null; expected: number; error: number | null; allowed: number }[];
  warnings: Warning[];
  expectedWarnings: string[];
  problems: string[];
}

export interface CoverageEntry {
  symbol: string;
  min: number;
  max: number;
  scale: 'log' | 'linear';
  /** Thirds of the range (low, middle, high) touched by at least one in-range check case. */
  touched: [boolean, boolean, boolean];
  outside: number;
}

export interface ValidationReport {
  engineVersion: string;
  reportFormat: number;
  passed: boolean;
  stages: { stage: Stage; passed: boolean; issues: DefinitionIssue[] }[];
  cases: CaseResult[];
  coverage: { entries: CoverageEntry[]; oneCorner: boolean; message: string };
  /** What the check cases prove (see lib/engine/evidence.ts); absent when validation stopped early. */
  evidence?: Evidence;
  summary: { checkCases: number; passed: number; failed: number; inRange: number; outOfRange: number; bySource: Record<string, number> };
}

const ORDER: Stage[] = ['schema', 'expressions', 'symbols', 'dimensions', 'check-cases', 'coverage'];

function runCase(c: Evaluator, cc: CheckCase, index: number): CaseResult {
  const expectedWarnings = [...(cc.expectWarnings ?? [])].sort();
  const result: CaseResult = {
    index, label: cc.label, passed: false, sourceKind: cc.source.kind, citation: cc.source.citation, locator: cc.source.locator,
    outputs: [], warnings: [], expectedWarnings, problems: [],
  };
  let outputs: Record<string, number> | null = null;
  try {
    const r = c.evaluate(cc.inputs);
    outputs = r.outputs;
    result.warnings = r.warnings;
    if (cc.expectRefusal) result.problems.push('expected the evaluation to be refused by a hard limit, but it gave a result');
  } catch (err) {
    if (err instanceof EvaluationError) {
      result.warnings = err.warnings;
      if (!(cc.expectRefusal && err.code === 'refused')) result.problems.push(err.message);
    } else if (err instanceof InputError) {
      result.problems.push(...err.issues.map((i) => `${i.path}: ${i.message}`));
    } else throw err;
  }
  for (const [symbol, expected] of Object.entries(cc.expected)) {
    if (!c.outputSymbols.includes(symbol)) {
      result.problems.push(`expected value for "${symbol}", which is not an output (outputs: ${c.outputSymbols.join(', ')})`);
      continue;
    }
    const computed = outputs ? outputs[symbol] : null;
    const allowed = (cc.tolerance.abs ?? 0) + (cc.tolerance.rel ?? 0) * Math.abs(expected);
    const error = computed === null ? null : computed - expected;
    result.outputs.push({ symbol, computed, expected, error, allowed });
    if (error === null || !(Math.abs(error) <= allowed)) {
      if (error !== null) {
        const rel = expected !== 0 ? ` (${((Math.abs(error) / Math.abs(expected)) * 100).toPrecision(3)} %)` : '';
        result.problems.push(`${symbol}: computed ${computed} differs from expected ${expected} by ${Math.abs(error).toPrecision(3)}${rel}, more than the tolerance ${allowed.toPrecision(3)}`);
      }
    }
  }
  const warned = [...new Set(result.warnings.map((w) => w.symbol))].sort();
  if (warned.join() !== expectedWarnings.join()) {
    result.problems.push(expectedWarnings.length || warned.length
      ? `expected range warnings for [${expectedWarnings.join(', ') || 'none'}] but got [${warned.join(', ') || 'none'}]`
      : 'warnings differ');
  }
  result.passed = result.problems.length === 0;
  return result;
}

function coverageOf(c: Evaluator, cases: CheckCase[], results: CaseResult[]): ValidationReport['coverage'] {
  const entries: CoverageEntry[] = [];
  const inRange = new Set(cases.filter((_, i) => results[i].warnings.length === 0 && !cases[i].expectRefusal));
  // Each case's inputs in declared units, read once (null when they cannot be read).
  const values = cases.map((cc) => { try { return c.readInputs(cc.inputs, 'inputs'); } catch { return null; } });
  c.definition.inputs.forEach((inp, k) => {
    // Published limits first; a table's range stands in where the definition declares none.
    const own = boundsAmong(c.limits.filter((l) => !l.note?.startsWith('table:')), inp.symbol);
    const any = boundsAmong(c.limits, inp.symbol);
    const min = own.min ?? any.min;
    const max = own.max ?? any.max;
    if (min === undefined || max === undefined) return;
    const log = isLogRange(min, max);
    const pos = (x: number) => (log ? (Math.log(x) - Math.log(min)) / (Math.log(max) - Math.log(min)) : (x - min) / (max - min));
    const touched: [boolean, boolean, boolean] = [false, false, false];
    let outside = 0;
    cases.forEach((cc, i) => {
      const raw = cc.inputs[inp.symbol];
      const x = values[i]?.[k] ?? (typeof raw === 'number' ? raw : NaN);
      if (!(x >= min && x <= max)) { outside++; return; }
      if (inRange.has(cc)) touched[Math.min(2, Math.floor(pos(x) * 3))] = true;
    });
    entries.push({ symbol: inp.symbol, min, max, scale: log ? 'log' : 'linear', touched, outside });
  });
  const oneCorner = entries.length > 0 && inRange.size > 0 && entries.every((e) => e.touched.filter(Boolean).length <= 1);
  const message = entries.length === 0
    ? 'no input has both a minimum and a maximum, so range coverage cannot be judged'
    : oneCorner
      ? 'the in-range check cases all sit in one corner of the validity range: every bounded input is exercised in one third of its range only'
      : `check cases touch ${entries.map((e) => `${e.symbol}: ${e.touched.filter(Boolean).length}/3`).join(', ')} thirds of the validity ranges`;
  return { entries, oneCorner, message };
}

type Compile = (definition: unknown, add: (issues: DefinitionIssue[]) => void, passed: (s: Stage) => boolean) => Evaluator | null;

function validateWith(definition: unknown, checkCases: unknown[], schemaIssues: (d: unknown) => { pointer: string; message: string }[], compile: Compile, policy: EvidencePolicy): ValidationReport {
  const stages: ValidationReport['stages'] = ORDER.map((stage) => ({ stage, passed: true, issues: [] }));
  const stage = (s: Stage) => stages.find((x) => x.stage === s)!;
  const add = (issues: DefinitionIssue[]) => {
    for (const i of issues) { stage(i.stage).issues.push(i); stage(i.stage).passed = false; }
  };
  const report = (cases: CaseResult[] = [], coverage?: ValidationReport['coverage'], evidence?: Evidence): ValidationReport => {
    const bySource: Record<string, number> = {};
    for (const c of cases) bySource[c.sourceKind] = (bySource[c.sourceKind] ?? 0) + 1;
    const outOfRange = cases.filter((c) => c.expectedWarnings.length > 0).length;
    const staticPassed = stages.filter((s) => s.stage !== 'coverage').every((s) => s.passed);
    return {
      engineVersion: ENGINE_VERSION, reportFormat: REPORT_FORMAT, passed: staticPassed, stages, cases,
      coverage: coverage ?? { entries: [], oneCorner: false, message: 'not reached' },
      ...(evidence ? { evidence } : {}),
      summary: { checkCases: cases.length, passed: cases.filter((c) => c.passed).length, failed: cases.filter((c) => !c.passed).length, inRange: cases.length - outOfRange, outOfRange, bySource },
    };
  };

  add(schemaIssues(definition).map((i) => ({ stage: 'schema' as const, ...i })));
  if (!Array.isArray(checkCases)) {
    add([{ stage: 'schema', pointer: '/checkCases', message: 'check cases must be a list' }]);
    return report();
  }
  checkCases.forEach((cc, i) => add(checkCheckCaseSchema(cc).map((x) => ({ stage: 'schema' as const, pointer: `/checkCases/${i}${x.pointer === '/' ? '' : x.pointer}`, message: x.message }))));
  if (!stage('schema').passed) return report();

  const c = compile(definition, add, (s) => stage(s).passed);
  if (!c) return report();
  const cases = (checkCases as CheckCase[]).map((cc, i) => runCase(c, cc, i));
  const checkStage = stage('check-cases');
  if (cases.length === 0) {
    checkStage.passed = false;
    checkStage.issues.push({ stage: 'check-cases', pointer: '/checkCases', message: 'a version needs at least one check case' });
  }
  for (const r of cases) {
    if (!r.passed) {
      checkStage.passed = false;
      checkStage.issues.push({ stage: 'check-cases', pointer: `/checkCases/${r.index}`, message: `"${r.label}": ${r.problems.join('; ')}` });
    }
  }
  const coverage = coverageOf(c, checkCases as CheckCase[], cases);
  if (coverage.oneCorner) {
    stage('coverage').passed = false;
    stage('coverage').issues.push({ stage: 'coverage', pointer: '/checkCases', message: coverage.message });
  }
  const evidence = evidenceOf({ definition: definition as Pick<Definition, 'accuracy'>, checkCases: checkCases as CheckCase[], passed: cases.map((r) => r.passed), coverage: coverage.entries, policy });
  return report(cases, coverage, evidence);
}

/**
 * Runs the full validation of a correlation version: schema → expression safety → symbols →
 * dimensions → every check case → coverage. Stops compiling at the first failing static stage but
 * always reports what it found.
 */
export function validateVersion(definition: unknown, checkCases: unknown[], policy: EvidencePolicy = DEFAULT_POLICY): ValidationReport {
  return validateWith(definition, checkCases, checkDefinitionSchema, (d, add, passed) => {
    const def = d as Definition;
    const { analysed, issues } = analyseDefinition(def);
    add(issues);
    if (!analysed) return null;
    add(checkDimensions(analysed));
    const cost = rowCostOf(analysed);
    if (cost > MAX_ROW_COST) {
      add([{ stage: 'expressions', pointer: '/steps', message: `the definition is too expensive to evaluate: about ${cost.toLocaleString('en')} operations per row (implicit solves count ${SOLVE_ITERATIONS} times), more than the ${MAX_ROW_COST.toLocaleString('en')} allowed; simplify it or split it into a calculation template` }]);
    }
    if (!passed('dimensions') || !passed('expressions')) return null;
    return compiled(def);
  }, policy);
}

/**
 * Validation of a calculation template version: the same stages, where "symbols" also covers the
 * pinned correlation versions (each must exist, be approved and match its content hash: `resolve`
 * says so) and "dimensions" every binding between steps. Check cases run through the whole chain.
 */
export function validateTemplate(definition: unknown, checkCases: unknown[], resolve: Resolve, policy: EvidencePolicy = DEFAULT_POLICY): ValidationReport {
  return validateWith(definition, checkCases, checkTemplateSchema, (d, add) => {
    try {
      return compileChain(d as TemplateDefinition, resolve);
    } catch (err) {
      if (!(err instanceof DefinitionError)) throw err;
      add(err.issues);
      return null;
    }
  }, policy);
}
