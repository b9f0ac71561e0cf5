import type { MathNode } from 'mathjs';
import { checkExpression, ExpressionError, FUNCTIONS, FUNCTION_IMPLS, toJs, BUILTIN_CONSTANTS } from './expressions';
import { breaks, compileLimits, EvaluationError, readInputValues, warningOf, type CompiledDefinition, type CompiledLimit } from './compile';
import { DefinitionError, type DefinitionIssue } from './analyse';
import { convert, describeDimension, hasDimensionOf, isDimensionless, isOffsetUnit, parseUnit, quantity } from './units';
import { sameDimension } from './dimensions';
import { canonicalJson, sha256Hex } from './canonical';
import { pinsOf } from './template-types';
import type { ChainResult, ChainStep, ChainWarning, CorrelationStep, ExpressionStep, LeafStep, Pin, StepRecord, TemplateDefinition } from './template-types';

/**
 * Chains pinned correlation versions and arithmetic steps into one calculation. Pure engine code:
 * the caller resolves each pin to a compiled, integrity-checked correlation first.
 *
 * Values live in one Float64Array of chain slots (declared units). A correlation step copies its
 * inputs into the correlation's own work array with the unit conversion found at compile time,
 * runs the correlation's generated code and copies the mapped outputs back; an expression step is
 * code generated from the checked tree over the chain slots, as in a definition.
 */

export type Resolve = (pin: Pin) => CompiledDefinition | { problem: string };


interface LeafRuntime {
  cost: number;
  steps: number;
  key: string;
  title: string;
  kind: 'correlation' | 'expression';
  pin: Pin | null;
  /** What the step reads, under the name and in the unit it takes it (value = a·v[slot] + b), and writes. */
  reads: { name: string; slot: number; unit: string; a: number; b: number }[];
  writes: { symbol: string; slot: number; unit: string }[];
  /** `scale` (by slot), when given, multiplies a correlation step's outputs: the perturbation a Monte Carlo run applies. */
  run(v: Float64Array, sink: ChainWarning[] | null, scale?: Float64Array | null): void;
}

interface ChoiceRuntime {
  key: string;
  title: string;
  rule: string;
  conditions: ((v: Float64Array) => number)[];
  options: { label: string; leaves: LeafRuntime[] }[];
}

type StepRuntime = { kind: 'leaf'; leaf: LeafRuntime } | { kind: 'choice'; choice: ChoiceRuntime };

export interface CompiledChain {
  hash: string;
  definition: TemplateDefinition;
  inputSymbols: string[];
  outputSymbols: string[];
  /** Unit of every chain symbol. */
  units: Map<string, string>;
  limits: CompiledLimit[];
  pins: Pin[];
  /** Estimated work of one row (the costliest option of each choice); see CompiledDefinition.rowCost. */
  rowCost: number;
  /** Steps evaluated per row (the longest option of each choice): what the rate limit counts. */
  stepsPerRow: number;
  readInputs(inputs: unknown, path: string): Float64Array;
  /** Outputs and every warning (with its step), as the check cases and the single API answer need. */
  evaluate(inputs: Record<string, unknown>): { outputs: Record<string, number>; warnings: ChainWarning[] };
  /**
   * One run with the record of every step. `factors` multiplies the named outputs of correlation
   * steps (by chain symbol): how a Monte Carlo run perturbs each correlation within its band.
   */
  runDetailed(values: ArrayLike<number>, factors?: Record<string, number>): ChainResult;
  /** Many rows (inputs flat in declared order): outputs flat; per-row warnings, errors and picks sparse. */
  runMany(rows: Float64Array, count: number): {
    outputs: Float64Array; warnings: Map<number, ChainWarning[]>; errors: Map<number, EvaluationError>;
    /** Per choice step (in order), the option index picked in each row. */
    picks: Uint8Array[];
  };
}

export function compileChain(def: TemplateDefinition, resolve: Resolve): CompiledChain {
  const issues: DefinitionIssue[] = [];
  const slots = new Map<string, number>();
  const units = new Map<string, string>();
  /** Symbols a step may read here: inside a choice's option, the option's own as well. */
  let visible = new Set<string>();
  /** Inside a choice: the symbols it gives, which every option writes to the same slot. */
  let shared: Map<string, string> | null = null;
  const declare = (symbol: string, unit: string, pointer: string) => {
    if (shared?.has(symbol) && slots.has(symbol)) {
      visible.add(symbol);
      if (units.get(symbol) !== unit) { issues.push({ stage: 'dimensions', pointer, message: `"${symbol}" is in ${units.get(symbol)} in an earlier option but in ${unit} here; every option must give it in the same unit` }); return false; }
      return true;
    }
    if (slots.has(symbol)) { issues.push({ stage: 'symbols', pointer, message: `"${symbol}" is already declared earlier in the chain` }); return false; }
    if (Object.hasOwn(FUNCTIONS, symbol) || Object.hasOwn(BUILTIN_CONSTANTS, symbol)) {
      issues.push({ stage: 'symbols', pointer, message: `"${symbol}" is a reserved name (a function or built-in constant); choose another symbol` });
      return false;
    }
    if (isOffsetUnit(unit)) issues.push({ stage: 'dimensions', pointer, message: `declare temperatures in K, not "${unit}"; callers may still send { "value": …, "unit": "degC" }` });
    else if (!isDimensionless(unit)) {
      try { parseUnit(unit); } catch (err) { issues.push({ stage: 'dimensions', pointer, message: (err as Error).message }); }
    }
    slots.set(symbol, slots.size);
    units.set(symbol, unit);
    visible.add(symbol);
    return true;
  };
  def.inputs.forEach((inp, i) => declare(inp.symbol, inp.unit, `/inputs/${i}/symbol`));
  const constants = def.constants ?? [];
  constants.forEach((c, i) => declare(c.symbol, c.unit, `/constants/${i}/symbol`));

  // Dimension checks evaluate each expression on quantities of magnitude 1 in the declared units.
  const dimScope = new Map<string, unknown>();
  const scopeOf = (symbol: string) => {
    if (!dimScope.has(symbol)) dimScope.set(symbol, quantity(1, units.get(symbol) ?? '1'));
    return dimScope.get(symbol);
  };
  const checked = (source: string, pointer: string): { node: MathNode; symbols: string[]; nodes: number } | null => {
    try {
      return checkExpression(source, visible);
    } catch (err) {
      if (!(err instanceof ExpressionError)) throw err;
      issues.push({ stage: err.unknownSymbol ? 'symbols' : 'expressions', pointer, message: err.unknownSymbol ? `"${err.unknownSymbol}" is not declared before this step: use the template's inputs, constants or earlier steps' outputs` : err.message });
      return null;
    }
  };
  const withUnits = (node: MathNode, symbols: string[]): unknown => {
    const scope = new Map<string, unknown>();
    for (const s of symbols) scope.set(s, scopeOf(s));
    return node.compile().evaluate(scope);
  };

  const compileCorrelation = (step: CorrelationStep, pointer: string): LeafRuntime | null => {
    const c = resolve(step.use);
    if ('problem' in c) { issues.push({ stage: 'symbols', pointer: `${pointer}/use`, message: `${step.use.slug} version ${step.use.version}: ${c.problem}` }); return null; }
    const def = c.definition;
    const reads: LeafRuntime['reads'] = [];
    const conversions: { slot: number; a: number; b: number }[] = [];
    for (const key of Object.keys(step.inputs)) {
      if (!c.inputSymbols.includes(key)) issues.push({ stage: 'symbols', pointer: `${pointer}/inputs/${key}`, message: `${step.use.slug} has no input "${key}" (it takes ${c.inputSymbols.join(', ')})` });
    }
    def.inputs.forEach((inp) => {
      const from = step.inputs[inp.symbol];
      if (from === undefined) { issues.push({ stage: 'symbols', pointer: `${pointer}/inputs`, message: `input "${inp.symbol}" of ${step.use.slug} is not bound to a chain symbol` }); return; }
      const slot = visible.has(from) ? slots.get(from) : undefined;
      if (slot === undefined) { issues.push({ stage: 'symbols', pointer: `${pointer}/inputs/${inp.symbol}`, message: `"${from}" is not declared before this step` }); return; }
      const unit = units.get(from)!;
      if (!sameDimension(unit, inp.unit)) {
        issues.push({ stage: 'dimensions', pointer: `${pointer}/inputs/${inp.symbol}`, message: `${from} is in ${isDimensionless(unit) ? 'no unit (dimensionless)' : unit} but ${step.use.slug} takes ${inp.symbol} in ${isDimensionless(inp.unit) ? 'no unit (dimensionless)' : inp.unit}` });
        return;
      }
      const b = convert(0, unit, inp.unit);
      const a = convert(1, unit, inp.unit) - b;
      conversions.push({ slot, a, b });
      reads.push({ name: inp.symbol, slot, unit: inp.unit, a, b });
    });
    const writes: LeafRuntime['writes'] = [];
    const outputCopies: { from: number; to: number; symbol: string }[] = [];
    for (const [out, as] of Object.entries(step.outputs)) {
      const j = c.outputSymbols.indexOf(out);
      if (j < 0) { issues.push({ stage: 'symbols', pointer: `${pointer}/outputs/${out}`, message: `${step.use.slug} has no output "${out}" (it gives ${c.outputSymbols.join(', ')})` }); continue; }
      const unit = def.outputs[j].unit;
      if (!declare(as, unit, `${pointer}/outputs/${out}`)) continue;
      writes.push({ symbol: as, slot: slots.get(as)!, unit });
      outputCopies.push({ from: c.outputSlots[j], to: slots.get(as)!, symbol: as });
    }
    if (conversions.length !== def.inputs.length) return null;
    const work = new Float64Array(c.nSlots);
    const nIn = conversions.length;
    let sink: ChainWarning[] | null = null;
    const key = step.key;
    const W = (index: number, value: number) => {
      const lim = c.limits[index];
      const w: ChainWarning = { ...warningOf(lim, value), step: key };
      if (lim.action === 'refuse') throw new EvaluationError('refused', `step "${key}": ${w.message}. This limit is marked hard: no result is given.`, lim.symbol, [...(sink ?? []), w]);
      sink?.push(w);
    };
    return {
      cost: c.rowCost, steps: c.stepsPerRow, key, title: step.title, kind: 'correlation', pin: step.use, reads, writes,
      run(v, s, scale) {
        sink = s;
        for (let i = 0; i < nIn; i++) { const k = conversions[i]; work[i] = k.a * v[k.slot] + k.b; }
        c.exec(work, W);
        for (const o of outputCopies) {
          const x = work[o.from];
          if (!Number.isFinite(x)) throw new EvaluationError('not-finite', `step "${key}": ${o.symbol} cannot be computed for these inputs (the correlation gives ${x})`, o.symbol, sink ?? []);
          v[o.to] = scale ? x * scale[o.to] : x;
        }
      },
    };
  };

  const compileExpression = (step: ExpressionStep, pointer: string): LeafRuntime | null => {
    const reads = new Map<string, number>();
    const writes: LeafRuntime['writes'] = [];
    const code: string[] = [];
    let nodes = 0;
    step.outputs.forEach((out, i) => {
      const p = `${pointer}/outputs/${i}`;
      const ce = checked(out.expression, `${p}/expression`);
      if (ce) {
        nodes += ce.nodes;
        try {
          const value = withUnits(ce.node, ce.symbols);
          if (!hasDimensionOf(value, out.unit)) issues.push({ stage: 'dimensions', pointer: `${p}/expression`, message: `${out.symbol} has dimension ${describeDimension(value)} but is declared ${isDimensionless(out.unit) ? 'dimensionless (1)' : out.unit}` });
        } catch {
          issues.push({ stage: 'dimensions', pointer: `${p}/expression`, message: `the units of ${out.symbol} do not work out: it adds, subtracts or compares quantities of different dimensions, or applies a function to a quantity with a dimension` });
        }
        for (const s of ce.symbols) reads.set(s, slots.get(s)!);
      }
      const slot = declare(out.symbol, out.unit, `${p}/symbol`) ? slots.get(out.symbol) : undefined;
      if (ce && slot !== undefined) {
        code.push(`v[${slot}] = ${toJs(ce.node, slots)};`);
        code.push(`if (!Number.isFinite(v[${slot}])) return ${JSON.stringify(out.symbol)};`);
        writes.push({ symbol: out.symbol, slot, unit: out.unit });
      }
    });
    if (writes.length !== step.outputs.length) return null;
    // The body holds only numbers, v[i] slots and F.<whitelisted function> calls from the checked tree.
    const body = new Function('v', 'F', `"use strict";\n${code.join('\n')}\nreturn null;`) as (v: Float64Array, F: unknown) => string | null;
    const key = step.key;
    return {
      cost: nodes, steps: step.outputs.length, key, title: step.title, kind: 'expression', pin: null,
      // What the step takes from before it; a value it computes itself (h in q = h·A·ΔT) is not an input.
      reads: [...reads].filter(([name]) => !writes.some((w) => w.symbol === name)).map(([name, slot]) => ({ name, slot, unit: units.get(name)!, a: 1, b: 0 })), writes,
      run(v, sink) {
        const bad = body(v, FUNCTION_IMPLS);
        if (bad !== null) throw new EvaluationError('not-finite', `step "${key}": ${bad} cannot be computed for these inputs (the formula gives ${v[slots.get(bad)!]})`, bad, sink ?? []);
      },
    };
  };

  const compileLeaf = (step: LeafStep, pointer: string): LeafRuntime | null => {
    switch (step.kind) {
      case 'correlation': return compileCorrelation(step, pointer);
      case 'expression': return compileExpression(step, pointer);
      default: { const never: never = step; throw new Error(`unknown step kind ${JSON.stringify(never)}`); }
    }
  };

  const keys = new Set<string>();
  const useKey = (k: string, pointer: string) => {
    if (keys.has(k)) issues.push({ stage: 'symbols', pointer: `${pointer}/key`, message: `the step key "${k}" is used twice` });
    keys.add(k);
  };
  const runtime: StepRuntime[] = [];
  def.steps.forEach((step: ChainStep, i) => {
    const pointer = `/steps/${i}`;
    useKey(step.key, pointer);
    switch (step.kind) {
      case 'correlation':
      case 'expression': {
        const leaf = compileLeaf(step, pointer);
        if (leaf) runtime.push({ kind: 'leaf', leaf });
        return;
      }
      case 'choice': {
        const before = visible;
        shared = new Map(step.gives.map((g) => [g, '']));
        const conditions: ChoiceRuntime['conditions'] = [];
        const options: ChoiceRuntime['options'] = [];
        step.options.forEach((o, k) => {
          const p = `${pointer}/options/${k}`;
          const last = k === step.options.length - 1;
          if (last && o.when !== undefined) issues.push({ stage: 'symbols', pointer: `${p}/when`, message: 'the last option is the "otherwise" case and must not have a condition' });
          if (!last && o.when === undefined) issues.push({ stage: 'symbols', pointer: `${p}/when`, message: 'every option but the last needs a condition ("when")' });
          visible = new Set(before);
          if (o.when !== undefined) {
            const ce = checked(o.when, `${p}/when`);
            if (ce) {
              try { withUnits(ce.node, ce.symbols); } catch {
                issues.push({ stage: 'dimensions', pointer: `${p}/when`, message: 'the condition compares quantities of different dimensions' });
              }
              const f = new Function('v', 'F', `"use strict"; return ${toJs(ce.node, slots)};`) as (v: Float64Array, F: unknown) => number;
              conditions.push((v) => f(v, FUNCTION_IMPLS));
            }
          }
          const leaves = o.steps.map((leafStep, j) => { useKey(leafStep.key, `${p}/steps/${j}`); return compileLeaf(leafStep, `${p}/steps/${j}`); });
          const missing = step.gives.filter((g) => !visible.has(g));
          if (missing.length) issues.push({ stage: 'symbols', pointer: `${p}/steps`, message: `the option "${o.label}" does not give ${missing.join(', ')}, which the choice promises` });
          if (leaves.every((l): l is LeafRuntime => l !== null)) options.push({ label: o.label, leaves });
        });
        shared = null;
        visible = new Set([...before, ...step.gives]);
        if (options.length === step.options.length && conditions.length === step.options.length - 1) {
          runtime.push({ kind: 'choice', choice: { key: step.key, title: step.title, rule: step.rule, conditions, options } });
        }
        return;
      }
      default: { const never: never = step; throw new Error(`unknown step kind ${JSON.stringify(never)}`); }
    }
  });

  const outputSymbols = def.outputs.map((o) => o.symbol);
  def.outputs.forEach((o, i) => {
    if (!visible.has(o.symbol)) issues.push({ stage: 'symbols', pointer: `/outputs/${i}/symbol`, message: `"${o.symbol}" is not a symbol of the chain (a symbol computed inside a choice's option is visible after it only if the choice gives it)` });
  });
  const inputSymbols = def.inputs.map((i) => i.symbol);
  (def.validity ?? []).forEach((l, i) => {
    if (!inputSymbols.includes(l.symbol)) issues.push({ stage: 'symbols', pointer: `/validity/${i}/symbol`, message: `"${l.symbol}" is not an input of the template (limits on intermediate values belong to the correlations)` });
  });
  if (issues.length) throw new DefinitionError(issues);

  const limits = compileLimits(def.validity);
  const inputLimits = limits.map((lim) => ({ lim, slot: slots.get(lim.symbol)! }));
  const constantValues = constants.map((c) => ({ slot: slots.get(c.symbol)!, value: c.value }));
  const outputSlots = outputSymbols.map((s) => slots.get(s)!);
  const nSlots = slots.size;
  const nIn = inputSymbols.length;
  const choiceCount = runtime.filter((r) => r.kind === 'choice').length;

  type OnLeaf = (leaf: LeafRuntime, before: number, choice?: StepRecord['choice']) => void;
  /**
   * Runs the chain on v (inputs filled in). `picks` receives the option index of each choice;
   * `onLeaf` (detailed runs only) sees each executed step with the warning count before it.
   */
  const exec = (v: Float64Array, sink: ChainWarning[] | null, picks: number[] | null, onLeaf?: OnLeaf, scale?: Float64Array | null): void => {
    for (const { lim, slot } of inputLimits) {
      if (!breaks(lim, v[slot])) continue;
      const w: ChainWarning = { ...warningOf(lim, v[slot]), step: 'inputs' };
      if (lim.action === 'refuse') throw new EvaluationError('refused', `${w.message}. This limit is marked hard: no result is given.`, lim.symbol, [...(sink ?? []), w]);
      sink?.push(w);
    }
    for (const c of constantValues) v[c.slot] = c.value;
    for (const r of runtime) {
      if (r.kind === 'leaf') {
        const before = sink?.length ?? 0;
        r.leaf.run(v, sink, scale);
        onLeaf?.(r.leaf, before);
        continue;
      }
      const { conditions, options, key, title, rule } = r.choice;
      let k = 0;
      while (k < conditions.length && !conditions[k](v)) k++;
      picks?.push(k);
      const picked = options[k];
      for (const leaf of picked.leaves) {
        const b = sink?.length ?? 0;
        leaf.run(v, sink, scale);
        onLeaf?.(leaf, b, { key, title, rule, picked: picked.label, options: options.map((o) => o.label) });
      }
    }
  };

  const runDetailed = (values: ArrayLike<number>, factors?: Record<string, number>): ChainResult => {
    const v = new Float64Array(nSlots);
    for (let i = 0; i < nIn; i++) v[i] = values[i];
    let scale: Float64Array | null = null;
    if (factors) {
      scale = new Float64Array(nSlots).fill(1);
      for (const [symbol, f] of Object.entries(factors)) { const k = slots.get(symbol); if (k !== undefined) scale[k] = f; }
    }
    const steps: StepRecord[] = [];
    const warnings: ChainWarning[] = [];
    exec(v, warnings, null, (leaf, before, choice) => {
      steps.push({
        key: leaf.key, title: leaf.title, kind: leaf.kind, correlation: leaf.pin, ...(choice ? { choice } : {}),
        inputs: Object.fromEntries(leaf.reads.map((r) => [r.name, r.a * v[r.slot] + r.b])),
        outputs: Object.fromEntries(leaf.writes.map((w) => [w.symbol, v[w.slot]])),
        units: Object.fromEntries([...leaf.reads.map((r) => [r.name, r.unit]), ...leaf.writes.map((w) => [w.symbol, w.unit])]),
        warnings: warnings.slice(before),
      });
    }, scale);
    const outputs = Object.fromEntries(outputSymbols.map((s, i) => [s, v[outputSlots[i]]]));
    return { steps, outputs, warnings };
  };

  const readInputs = (inputs: unknown, path: string) => readInputValues(def.inputs, inputs, path);

  return {
    hash: sha256Hex(canonicalJson(def)),
    definition: def,
    inputSymbols,
    outputSymbols,
    units,
    limits,
    pins: pinsOf(def),
    rowCost: runtime.reduce((sum, r) => sum + (r.kind === 'leaf' ? r.leaf.cost : Math.max(...r.choice.options.map((o) => o.leaves.reduce((a, l) => a + l.cost, 0)))), 0),
    stepsPerRow: runtime.reduce((sum, r) => sum + (r.kind === 'leaf' ? r.leaf.steps : Math.max(...r.choice.options.map((o) => o.leaves.reduce((a, l) => a + l.steps, 0)))), 0),
    readInputs,
    evaluate(inputs) {
      const r = runDetailed(readInputs(inputs, 'inputs'));
      return { outputs: r.outputs, warnings: r.warnings };
    },
    runDetailed,
    runMany(rows, count) {
      const v = new Float64Array(nSlots);
      const nOut = outputSymbols.length;
      const outputs = new Float64Array(count * nOut);
      const warnings = new Map<number, ChainWarning[]>();
      const errors = new Map<number, EvaluationError>();
      const picks = Array.from({ length: choiceCount }, () => new Uint8Array(count));
      const sink: ChainWarning[] = [];
      const picked: number[] = [];
      for (let row = 0; row < count; row++) {
        sink.length = 0;
        picked.length = 0;
        for (let i = 0; i < nIn; i++) v[i] = rows[row * nIn + i];
        try {
          exec(v, sink, picked);
          for (let i = 0; i < nOut; i++) outputs[row * nOut + i] = v[outputSlots[i]];
        } catch (err) {
          if (!(err instanceof EvaluationError)) throw err;
          errors.set(row, err);
          for (let i = 0; i < nOut; i++) outputs[row * nOut + i] = NaN;
        }
        for (let k = 0; k < picked.length; k++) picks[k][row] = picked[k];
        if (sink.length) warnings.set(row, sink.slice());
      }
      return { outputs, warnings, errors, picks };
    },
  };
}
