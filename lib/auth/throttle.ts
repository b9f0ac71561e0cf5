import { createHash } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { db } from '@/models';
import { AppError } from '@/lib/http/errors';

/*
 * Wrong passwords slow their source down instead of locking the account: after FREE failures in a
 * bucket each further attempt must wait 2^(n − FREE) seconds (at most MAX_DELAY_S) after the last
 * failure; a success clears the bucket. Sign-in counts per account × client address (the attacker's
 * own address only), per client address, and per account with a much higher allowance (many
 * addresses guessing one account), the buckets keyed by the e-mail given whether or not an account
 * has it — so the answer never tells which accounts exist. Sign-off and password change count per person.
 */
export const FREE_FAILURES = 5;
const WIDE_FREE_FAILURES = 50;
const MAX_DELAY_S = 15 * 60;
/** Failures older than this are forgotten. */
const FORGET_MS = 60 * 60_000;

const key = (parts: string[]) => createHash('sha256').update(parts.join('\u0000')).digest('hex');

export type Bucket = { key: string; free: number };

export function signInBuckets(email: string, client: string): Bucket[] {
  const e = email.trim().toLowerCase();
  return [
    { key: key(['sign-in', e, client]), free: FREE_FAILURES },
    { key: key(['sign-in-address', client]), free: WIDE_FREE_FAILURES },
    { key: key(['sign-in-account', e]), free: WIDE_FREE_FAILURES },
  ];
}

export const personBuckets = (purpose: string, userId: number): Bucket[] => [{ key: key([purpose, String(userId)]), free: FREE_FAILURES }];

const delayOf = (failures: number, free: number) => (failures < free ? 0 : Math.min(MAX_DELAY_S, 2 ** (failures - free)));

/** Refuses with the time to wait when any bucket is still cooling down. */
export async function assertNotThrottled(buckets: Bucket[], what: string) {
  const rows = await db().sequelize.query<{ bucket: string; failures: number; last_failure_at: number }>(
    `SELECT bucket, failures, last_failure_at FROM password_throttle WHERE bucket IN (${buckets.map(() => '?').join(',')})`,
    { replacements: buckets.map((b) => b.key), type: QueryTypes.SELECT });
  const now = Date.now();
  let wait = 0;
  for (const r of rows) {
    if (now - Number(r.last_failure_at) > FORGET_MS) continue;
    const free = buckets.find((b) => b.key === r.bucket)!.free;
    wait = Math.max(wait, Number(r.last_failure_at) + delayOf(Number(r.failures), free) * 1000 - now);
  }
  if (wait > 0) {
    const s = Math.ceil(wait / 1000);
    throw new AppError('rate_limited:password', `Too many wrong passwords for ${what}. Wait ${s} second${s === 1 ? '' : 's'} before trying again.`, { retryAfterSeconds: s }, { 'Retry-After': String(s) });
  }
}

export async function recordFailure(buckets: Bucket[]) {
  const now = Date.now();
  await db().sequelize.query(
    `INSERT INTO password_throttle (bucket, failures, last_failure_at) VALUES ${buckets.map(() => '(?, 1, ?)').join(', ')}
     ON DUPLICATE KEY UPDATE failures = IF(? - last_failure_at > ?, 1, failures + 1), last_failure_at = VALUES(last_failure_at)`,
    { replacements: [...buckets.flatMap((b) => [b.key, now]), now, FORGET_MS], type: QueryTypes.INSERT });
}

export async function clearFailures(buckets: Bucket[]) {
  await db().sequelize.query(`DELETE FROM password_throttle WHERE bucket IN (${buckets.map(() => '?').join(',')})`,
    { replacements: buckets.map((b) => b.key), type: QueryTypes.DELETE });
}

/** Checks a password under the throttle: the wrong one counts, the right one clears. */
export async function throttledCheck(buckets: Bucket[], what: string, check: () => Promise<boolean>): Promise<boolean> {
  await assertNotThrottled(buckets, what);
  const ok = await check();
  if (ok) await clearFailures(buckets); else await recordFailure(buckets);
  return ok;
}
