import 'server-only';
import { AppError } from '@/lib/http/errors';
import type { AuthUser } from '@/lib/auth/users';
import { EvaluationError, InputError, type InputIssue } from '@/lib/engine/compile';
import type { ChainWarning } from '@/lib/engine/template-types';
import { recordUsage } from '@/lib/api/usage';
import { consumeRateLimit } from '@/lib/api/rate-limit';
import { loadVerifiedCorrelation, loadVerifiedTemplate, type RunnableChain } from './verified';
import { INLINE_WORK, runOnPool } from './pool';
import { bandsOf, propagate } from '@/lib/engine/uncertainty';
import { convert, isDimensionless } from '@/lib/engine/units';

export const MAX_ROWS = 10_000;
/** Field problems listed in one answer: the first ones and a count, never an answer larger than the body. */
export const MAX_LISTED_ISSUES = 100;

export interface EvaluateRequest {
  version?: number;
  inputs?: Record<string, unknown>;
  rows?: unknown[];
  /** Answer these outputs in these units (symbol → unit) instead of the declared ones. */
  outputUnits?: Record<string, string>;
}

/**
 * The unit each output is answered in, and the affine map from its declared unit. Unknown outputs and units of
 * another dimension are refused by field, before anything is evaluated.
 */
function outputConversion(declared: Map<string, string>, asked: Record<string, string> | undefined) {
  const units = Object.fromEntries(declared);
  const maps = new Map<string, { a: number; b: number }>();
  const issues: InputIssue[] = [];
  for (const [symbol, unit] of Object.entries(asked ?? {})) {
    const from = declared.get(symbol);
    if (from === undefined) { issues.push({ path: `outputUnits.${symbol}`, message: `not an output; the outputs are ${[...declared.keys()].join(', ')}` }); continue; }
    try {
      const b = convert(0, from, unit);
      maps.set(symbol, { a: convert(1, from, unit) - b, b });
      units[symbol] = unit;
    } catch (err) {
      issues.push({ path: `outputUnits.${symbol}`, message: `${(err as Error).message}; ${symbol} is declared in ${isDimensionless(from) ? 'no unit (dimensionless)' : `"${from}"`}` });
    }
  }
  if (issues.length) throw new AppError('invalid:outputUnits', `Output unit problem: ${issues.map((i) => `${i.path}: ${i.message}`).join('; ')}`, { issues });
  const apply = (symbol: string, value: number) => { const m = maps.get(symbol); return m ? m.a * value + m.b : value; };
  return { units, apply };
}

function assertRowCount(rows: unknown[] | undefined) {
  if (rows && rows.length > MAX_ROWS) {
    throw new AppError('too_large:rows', `A batch may hold at most ${MAX_ROWS} rows; this one has ${rows.length}. Split it into several requests.`);
  }
}

/** Reads every row's inputs into one flat array; all problems, by row and column, in one bounded error. */
function readRows(rows: unknown[], width: number, read: (row: unknown, path: string) => Float64Array): Float64Array {
  const flat = new Float64Array(rows.length * width);
  const issues: InputIssue[] = [];
  let count = 0;
  rows.forEach((row, r) => {
    try {
      flat.set(read(row, `rows[${r}]`), r * width);
    } catch (err) {
      if (!(err instanceof InputError)) throw err;
      count += err.issues.length;
      if (issues.length < MAX_LISTED_ISSUES) issues.push(...err.issues.slice(0, MAX_LISTED_ISSUES - issues.length));
    }
  });
  if (count) {
    throw new AppError('invalid:inputs', `${count} input problem${count === 1 ? '' : 's'}${count > issues.length ? ` (the first ${issues.length} listed)` : ''}, first: ${issues[0].path} ${issues[0].message}`, { issues, count });
  }
  return flat;
}

function refusal(err: unknown): never {
  if (err instanceof InputError) {
    throw new AppError('invalid:inputs', `Input problem: ${err.issues.slice(0, 5).map((i) => `${i.path}: ${i.message}`).join('; ')}`, { issues: err.issues.slice(0, MAX_LISTED_ISSUES), count: err.issues.length });
  }
  if (err instanceof EvaluationError) {
    throw new AppError(`invalid:${err.code === 'refused' ? 'refused' : err.code}`, err.message, { symbol: err.symbol, warnings: err.warnings });
  }
  throw err;
}

/**
 * Evaluates a correlation version (default: the approved one) for one input set or a batch of rows.
 * Withdrawn versions are served only when pinned, with a warning. Usage is recorded per version.
 */
export async function evaluateCorrelation({ actor, tokenId, slug, request }: { actor: AuthUser; tokenId: number | null; slug: string; request: EvaluateRequest }) {
  assertRowCount(request.rows);
  const { version: v, compiled: c, notices } = await loadVerifiedCorrelation({ actor, slug, version: request.version });
  const out = outputConversion(new Map(c.definition.outputs.map((o) => [o.symbol, o.unit])), request.outputUnits);
  // Each output's band: the version's stated accuracy (relative, so the same in any unit), the same for every row.
  const head = { slug, version: v.version, contentHash: v.contentHash, status: v.status, bands: bandsOf(c.definition), units: out.units };
  const count = request.rows?.length ?? 1;
  await consumeRateLimit({ userId: actor.id, tokenId, evaluations: count * c.stepsPerRow });

  if (request.rows) {
    const flat = readRows(request.rows, c.inputSymbols.length, c.readInputs);
    // Small batches run here, on the fast path; big ones on the worker pool within the time budget.
    const ran = count * c.rowCost <= INLINE_WORK ? c.runMany(flat, count)
      : await runOnPool({ kind: 'correlation', version: { definitionText: v.definitionText, contentHash: v.contentHash }, rows: flat, count }, `Evaluating ${count} rows of "${slug}"`);
    const m = c.outputSymbols.length;
    const results = request.rows.map((_, r) => {
      const err = ran.errors.get(r);
      if (err) return { outputs: null, warnings: err.warnings, error: { code: `refused:${err.code}`, message: err.message } };
      const outputs: Record<string, number> = {};
      for (let i = 0; i < m; i++) outputs[c.outputSymbols[i]] = out.apply(c.outputSymbols[i], ran.outputs[r * m + i]);
      return { outputs, warnings: ran.warnings.get(r) ?? [] };
    });
    recordUsage({ userId: actor.id, tokenId, versionId: v.id, evaluations: request.rows.length });
    return { ...head, ...(notices.length ? { warnings: notices } : {}), results };
  }

  try {
    const r = c.evaluate(request.inputs ?? {});
    recordUsage({ userId: actor.id, tokenId, versionId: v.id, evaluations: 1 });
    const outputs = Object.fromEntries(Object.entries(r.outputs).map(([s, x]) => [s, out.apply(s, x)]));
    return { ...head, outputs, warnings: [...notices, ...r.warnings] };
  } catch (err) {
    refusal(err);
  }
}

/**
 * Runs a chain for one input set — with the record of every step — or for a batch of rows
 * (outputs, warnings and the options picked, per row). Every version used counts as used.
 */
export async function runChain({ actor, tokenId, runnable, request }: { actor: AuthUser; tokenId: number | null; runnable: RunnableChain; request: EvaluateRequest }) {
  assertRowCount(request.rows);
  const { chain, template, notices } = runnable;
  const out = outputConversion(new Map(chain.outputSymbols.map((s) => [s, chain.units.get(s)!])), request.outputUnits);
  const head = {
    slug: template?.slug ?? null, version: template?.version ?? null, contentHash: template?.contentHash ?? null, status: template?.status ?? null,
    title: template?.title ?? chain.definition.title, units: out.units,
  };
  const count = request.rows ? request.rows.length : 1;
  await consumeRateLimit({ userId: actor.id, tokenId, evaluations: count * chain.stepsPerRow });
  const used = () => {
    for (const id of runnable.usedVersionIds) recordUsage({ userId: actor.id, tokenId, versionId: id, evaluations: count });
  };

  if (request.rows) {
    const flat = readRows(request.rows, chain.inputSymbols.length, chain.readInputs);
    const ran = count * chain.rowCost <= INLINE_WORK ? chain.runMany(flat, count)
      : await runOnPool<ChainWarning>({ kind: 'chain', key: template?.contentHash ?? null, definition: chain.definition, pins: runnable.pinned, rows: flat, count }, `Running ${count} rows of "${head.title}"`);
    const m = chain.outputSymbols.length;
    const choices = chain.definition.steps.flatMap((s) => (s.kind === 'choice' ? [s] : []));
    const results = request.rows.map((_, r) => {
      const picked = Object.fromEntries(choices.map((s, k) => [s.key, s.options[ran.picks[k][r]]?.label ?? null]));
      const err = ran.errors.get(r);
      if (err) return { outputs: null, warnings: err.warnings, picked, error: { code: `refused:${err.code}`, message: err.message } };
      const outputs: Record<string, number> = {};
      for (let i = 0; i < m; i++) outputs[chain.outputSymbols[i]] = out.apply(chain.outputSymbols[i], ran.outputs[r * m + i]);
      return { outputs, warnings: ran.warnings.get(r) ?? [], picked };
    });
    used();
    return { ...head, ...(notices.length ? { warnings: notices } : {}), results };
  }

  try {
    const values = chain.readInputs(request.inputs ?? {}, 'inputs');
    const r = chain.runDetailed(values);
    used();
    // The band of every result and its budget by step: first-order propagation of the stated accuracies.
    let uncertainty: ReturnType<typeof propagate> | undefined;
    try { uncertainty = propagate(chain, runnable.resolve, values, r); } catch (err) { console.error('band propagation failed', err); }
    // Steps stay in their declared units (the record of the chain); the results in the units asked for.
    const outputs = Object.fromEntries(Object.entries(r.outputs).map(([s, x]) => [s, out.apply(s, x)]));
    return { ...head, steps: r.steps, outputs, warnings: [...notices, ...r.warnings], uncertainty };
  } catch (err) {
    refusal(err);
  }
}

/** Runs a calculation template (default: its approved version). */
export async function runTemplate({ actor, tokenId, slug, request }: { actor: AuthUser; tokenId: number | null; slug: string; request: EvaluateRequest }) {
  assertRowCount(request.rows);
  const runnable = await loadVerifiedTemplate({ actor, slug, version: request.version });
  return runChain({ actor, tokenId, runnable, request });
}
