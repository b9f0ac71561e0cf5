import { QueryTypes } from 'sequelize';
import { db } from '@/models';
import { AppError } from '@/lib/http/errors';

const WINDOW_MS = 60_000;
/** How often each instance adds its counts to the shared ones in MariaDB and learns the others' (ms). */
export const RATE_SYNC_MS = Math.max(10, Number(process.env.RATE_SYNC_MS ?? 200));

export function rateLimitPerMinute(): number {
  const n = Number(process.env.RATE_LIMIT_PER_MINUTE ?? 600);
  return Number.isFinite(n) && n > 0 ? n : 600;
}

export function evaluationLimitPerMinute(): number {
  const n = Number(process.env.RATE_LIMIT_EVALUATIONS_PER_MINUTE ?? 20_000_000);
  return Number.isFinite(n) && n > 0 ? n : 20_000_000;
}

/**
 * Fixed one-minute windows per token and per user, for requests and for evaluations (rows × steps per row, so a
 * batch of 10,000 rows through a long chain costs what it costs), shared by every app instance through MariaDB.
 *
 * Each instance counts in memory and decides at once (no database round trip on the request path, but for the first
 * use of a bucket in a window, which reads the shared count); every
 * RATE_SYNC_MS it adds its counts to the shared rows in one statement (INSERT … ON DUPLICATE KEY UPDATE …
 * RETURNING) and learns the totals of all instances. A request is refused when the last known shared total plus
 * what this instance has counted since exceeds the limit. One instance alone is exact; with N instances the window
 * can overshoot by at most what the other N − 1 admit within one sync period before each learns of it (at most
 * (N − 1) × their request rate × RATE_SYNC_MS, and never more than (N − 1) × the limit). If the database cannot
 * be reached the counts stay in memory and are added at the next sync.
 */
interface Bucket { window: number; shared: number; pending: number; known: boolean }
const buckets = new Map<string, Bucket>();
let timer: NodeJS.Timeout | null = null;
let syncing: Promise<void> | null = null;

function bucketOf(key: string, window: number): Bucket {
  let b = buckets.get(key);
  if (!b || b.window !== window) {
    b = { window, shared: 0, pending: 0, known: false };
    buckets.set(key, b);
  }
  return b;
}

function schedule() {
  if (timer) return;
  timer = setTimeout(() => { timer = null; void syncRateLimits().catch(() => undefined); }, RATE_SYNC_MS);
  timer.unref();
}

/** Adds this instance's counts to the shared rows and learns every instance's totals (one statement). */
export async function syncRateLimits(): Promise<void> {
  if (syncing) return syncing;
  const due = [...buckets.entries()].filter(([, b]) => b.pending > 0);
  if (!due.length) return;
  const sent = due.map(([key, b]) => ({ key, b, n: b.pending, window: b.window }));
  for (const s of sent) s.b.pending -= s.n;
  syncing = (async () => {
    try {
      const rows = await db().sequelize.query<{ bucket: string; window_start: number | string | Date; hits: number }>(
        `INSERT INTO rate_limit_windows (bucket, window_start, hits) VALUES ${sent.map(() => '(?, ?, ?)').join(', ')}
         ON DUPLICATE KEY UPDATE hits = hits + VALUES(hits) RETURNING bucket, window_start, hits`,
        { replacements: sent.flatMap((s) => [s.key, s.window, s.n]), type: QueryTypes.SELECT },
      );
      for (const r of rows) {
        const b = buckets.get(r.bucket);
        if (b && b.window === Number(r.window_start)) { b.shared = Math.max(b.shared, Number(r.hits)); b.known = true; }
      }
    } catch (err) {
      // Keep the counts for the next sync.
      for (const s of sent) if (s.b.window === s.window) s.b.pending += s.n;
      throw err;
    } finally {
      syncing = null;
      if ([...buckets.values()].some((b) => b.pending > 0)) schedule();
    }
  })();
  return syncing;
}

export async function consumeRateLimit({ userId, tokenId, evaluations = 0 }: { userId: number; tokenId: number | null; evaluations?: number }) {
  const now = Date.now();
  const window = Math.floor(now / WINDOW_MS) * WINDOW_MS;
  const who = [`user:${userId}`, ...(tokenId ? [`token:${tokenId}`] : [])];
  const wanted: [string, number, number][] = [
    ...who.map((k): [string, number, number] => [k, 1, rateLimitPerMinute()]),
    ...(evaluations > 0 ? who.map((k): [string, number, number] => [`eval:${k}`, Math.ceil(evaluations), evaluationLimitPerMinute()]) : []),
  ];
  // The first use of a bucket in a window on this instance reads what the others have counted so far (one query a
  // minute per bucket); after that the request path does not wait for the database.
  const unknown = wanted.map(([key]) => key).filter((key) => !bucketOf(key, window).known);
  if (unknown.length) {
    const rows = await db().sequelize.query<{ bucket: string; hits: number }>('SELECT bucket, hits FROM rate_limit_windows WHERE window_start = ? AND bucket IN (?)',
      { replacements: [window, unknown], type: QueryTypes.SELECT });
    for (const key of unknown) {
      const b = bucketOf(key, window);
      b.shared = Math.max(b.shared, Number(rows.find((r) => r.bucket === key)?.hits ?? 0));
      b.known = true;
    }
  }
  const over = wanted.find(([key, n, limit]) => { const b = bucketOf(key, window); return b.shared + b.pending + n > limit; });
  if (over) {
    const [key, , limit] = over;
    const retryAfter = Math.max(1, Math.ceil((window + WINDOW_MS - now) / 1000));
    const evals = key.startsWith('eval:');
    const kind = key.replace(/^eval:/, '').split(':')[0];
    throw new AppError(`rate_limited:${evals ? 'evaluations' : 'requests'}`, evals
      ? `Too many evaluations for this ${kind}: at most ${limit.toLocaleString('en')} (rows × steps) a minute. Retry in ${retryAfter} s.`
      : `Too many requests for this ${kind}: at most ${limit} a minute. Retry in ${retryAfter} s.`, { limit, retryAfterSeconds: retryAfter }, { 'Retry-After': String(retryAfter) });
  }
  for (const [key, n] of wanted) bucketOf(key, window).pending += n;
  schedule();
  // Buckets of past windows leave memory; old shared rows are cleared now and then (a stale row only costs space).
  if (buckets.size > 50_000) for (const [k, b] of buckets) if (b.window < window && b.pending === 0) buckets.delete(k);
  if (Math.random() < 0.0005) {
    void db().sequelize.query('DELETE FROM rate_limit_windows WHERE window_start < ?', { replacements: [window - 10 * WINDOW_MS], type: QueryTypes.DELETE }).catch(() => undefined);
  }
}
