import 'server-only';
import { availableParallelism } from 'node:os';
import { join } from 'node:path';
import Piscina from 'piscina';
import { AppError } from '@/lib/http/errors';
import { EvaluationError } from '@/lib/engine/compile';
import type { Pin, TemplateDefinition } from '@/lib/engine/template-types';
import type { Warning } from '@/lib/engine/types';

/*
 * Heavy evaluations run on a pool of worker threads, so one expensive batch never holds up the
 * request loop (health checks, sign-in, everyone else's single evaluations). A request is small when
 * rows × estimated row cost stays under INLINE_WORK: it runs inline, on the fast path. Anything
 * bigger goes to the pool with a time budget; over the budget the worker is stopped and the caller
 * gets a clear "too expensive" answer. The queue is bounded: when it is full the answer is 503 busy.
 */
export const INLINE_WORK = 2_000_000;
const budgetMs = () => Number(process.env.EVALUATION_BUDGET_MS ?? 10_000);
const MAX_QUEUE = 32;

let pool: Piscina | null = null;
function thePool(): Piscina {
  pool ??= new Piscina({
    // Started from disk as plain JavaScript (the bundler does not follow it); it loads the same engine sources.
    filename: join(process.cwd(), 'lib', 'evaluation', 'pool-worker.cjs'),
    minThreads: 1, maxThreads: Math.max(1, Math.min(4, availableParallelism() - 1)), maxQueue: MAX_QUEUE, idleTimeout: 120_000,
  });
  return pool;
}

export interface RowsResult<W extends Warning = Warning> {
  outputs: Float64Array;
  warnings: Map<number, W[]>;
  errors: Map<number, EvaluationError>;
  picks: Uint8Array[];
}

interface PlainResult { outputs: Float64Array; warnings: [number, never[]][]; errors: [number, { code: EvaluationError['code']; message: string; symbol?: string; warnings: Warning[] }][]; picks: Uint8Array[] }

export type PoolTask =
  | { kind: 'correlation'; version: { definitionText: string; contentHash: string | null }; rows: Float64Array; count: number }
  | { kind: 'chain'; key: string | null; definition: TemplateDefinition; pins: (Pin & { definitionText: string })[]; rows: Float64Array; count: number };

/** Runs rows on the pool within the time budget; the answer has the shape of runMany's. */
export async function runOnPool<W extends Warning = Warning>(task: PoolTask, what: string): Promise<RowsResult<W>> {
  const budget = budgetMs();
  const signal = AbortSignal.timeout(budget);
  let plain: PlainResult;
  try {
    plain = await thePool().run(task, { signal, transferList: [task.rows.buffer as ArrayBuffer] });
  } catch (err) {
    if (signal.aborted || (err as Error).name === 'AbortError') {
      throw new AppError('invalid:too-expensive', `${what} took longer than the ${Math.round(budget / 1000)} s an evaluation may take and was stopped; send fewer rows per request, or simplify the definition.`, { budgetMs: budget, rows: task.count });
    }
    if (/queue is full/i.test((err as Error).message)) {
      throw new AppError('unavailable:busy', 'The server is busy with other large evaluations; retry in a few seconds.', undefined, { 'Retry-After': '5' });
    }
    throw err;
  }
  return {
    outputs: plain.outputs,
    warnings: new Map(plain.warnings) as Map<number, W[]>,
    errors: new Map(plain.errors.map(([row, e]) => [row, new EvaluationError(e.code, e.message, e.symbol, e.warnings)])),
    picks: plain.picks,
  };
}

