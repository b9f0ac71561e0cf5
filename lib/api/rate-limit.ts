import { QueryTypes } from 'sequelize';
import { db } from '@/models';
import { AppError } from '@/lib/http/errors';

const WINDOW_MS = 60_000;

export function rateLimitPerMinute(): number {
  const n = Number(process.env.RATE_LIMIT_PER_MINUTE ?? 600);
  return Number.isFinite(n) && n > 0 ? n : 600;
}

/**
 * Fixed one-minute windows per token and per user, counted in MariaDB so that every app instance
 * behind the same database shares them. One statement per request (INSERT … ON DUPLICATE KEY
 * UPDATE … RETURNING). Over the limit → 429 with Retry-After.
 */
export async function consumeRateLimit({ userId, tokenId }: { userId: number; tokenId: number | null }) {
  const { sequelize } = db();
  const now = Date.now();
  const windowStart = Math.floor(now / WINDOW_MS) * WINDOW_MS;
  const buckets = [`user:${userId}`, ...(tokenId ? [`token:${tokenId}`] : [])];
  const rows = await sequelize.query<{ bucket: string; hits: number }>(
    `INSERT INTO rate_limit_windows (bucket, window_start, hits) VALUES ${buckets.map(() => '(?, ?, 1)').join(', ')}
     ON DUPLICATE KEY UPDATE hits = hits + 1 RETURNING bucket, hits`,
    { replacements: buckets.flatMap((b) => [b, windowStart]), type: QueryTypes.SELECT },
  );
  const limit = rateLimitPerMinute();
  const over = rows.find((r) => Number(r.hits) > limit);
  if (over) {
    const retryAfter = Math.max(1, Math.ceil((windowStart + WINDOW_MS - now) / 1000));
    throw new AppError('rate_limited:requests', `Too many requests for this ${over.bucket.split(':')[0]}: at most ${limit} a minute. Retry in ${retryAfter} s.`, { limit, retryAfterSeconds: retryAfter }, { 'Retry-After': String(retryAfter) });
  }
  // Old windows are cleared now and then; a stale row only costs space.
  if (Math.random() < 0.001) {
    void sequelize.query('DELETE FROM rate_limit_windows WHERE window_start < ?', { replacements: [windowStart - 10 * WINDOW_MS], type: QueryTypes.DELETE }).catch(() => undefined);
  }
}
