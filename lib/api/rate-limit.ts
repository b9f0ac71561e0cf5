import { QueryTypes } from 'sequelize';
import { db } from '@/models';
import { AppError } from '@/lib/http/errors';

const WINDOW_MS = 60_000;

export function rateLimitPerMinute(): number {
  const n = Number(process.env.RATE_LIMIT_PER_MINUTE ?? 600);
  return Number.isFinite(n) && n > 0 ? n : 600;
}

export function evaluationLimitPerMinute(): number {
  const n = Number(process.env.RATE_LIMIT_EVALUATIONS_PER_MINUTE ?? 20_000_000);
  return Number.isFinite(n) && n > 0 ? n : 20_000_000;
}

/**
 * Fixed one-minute windows per token and per user, counted in MariaDB so that every app instance
 * behind the same database shares them: requests, and evaluations (rows × steps per row), so a batch
 * of 10,000 rows through a long chain costs what it costs. One statement per request
 * (INSERT … ON DUPLICATE KEY UPDATE … RETURNING). Over either limit → 429 with Retry-After.
 */
export async function consumeRateLimit({ userId, tokenId, evaluations = 0 }: { userId: number; tokenId: number | null; evaluations?: number }) {
  const { sequelize } = db();
  const now = Date.now();
  const windowStart = Math.floor(now / WINDOW_MS) * WINDOW_MS;
  const who = [`user:${userId}`, ...(tokenId ? [`token:${tokenId}`] : [])];
  const buckets: [string, number][] = [...who.map((b): [string, number] => [b, 1]), ...(evaluations > 0 ? who.map((b): [string, number] => [`eval:${b}`, Math.ceil(evaluations)]) : [])];
  const rows = await sequelize.query<{ bucket: string; hits: number }>(
    `INSERT INTO rate_limit_windows (bucket, window_start, hits) VALUES ${buckets.map(() => '(?, ?, ?)').join(', ')}
     ON DUPLICATE KEY UPDATE hits = hits + VALUES(hits) RETURNING bucket, hits`,
    { replacements: buckets.flatMap(([b, n]) => [b, windowStart, n]), type: QueryTypes.SELECT },
  );
  const limit = rateLimitPerMinute();
  const evalLimit = evaluationLimitPerMinute();
  const over = rows.find((r) => Number(r.hits) > (r.bucket.startsWith('eval:') ? evalLimit : limit));
  if (over) {
    const retryAfter = Math.max(1, Math.ceil((windowStart + WINDOW_MS - now) / 1000));
    const evals = over.bucket.startsWith('eval:');
    const kind = over.bucket.replace(/^eval:/, '').split(':')[0];
    throw new AppError(`rate_limited:${evals ? 'evaluations' : 'requests'}`, evals
      ? `Too many evaluations for this ${kind}: at most ${evalLimit.toLocaleString('en')} (rows × steps) a minute. Retry in ${retryAfter} s.`
      : `Too many requests for this ${kind}: at most ${limit} a minute. Retry in ${retryAfter} s.`, { limit: evals ? evalLimit : limit, retryAfterSeconds: retryAfter }, { 'Retry-After': String(retryAfter) });
  }
  // Old windows are cleared now and then; a stale row only costs space.
  if (Math.random() < 0.001) {
    void sequelize.query('DELETE FROM rate_limit_windows WHERE window_start < ?', { replacements: [windowStart - 10 * WINDOW_MS], type: QueryTypes.DELETE }).catch(() => undefined);
  }
}
