import { QueryTypes } from 'sequelize';
import { db } from '@/models';

/*
 * Evaluations are counted per day × user × token (0 = browser session) × version. These rows answer
 * "who used this version" when it is withdrawn. Under load every request of one integrator hits the
 * same row, so counts are gathered in memory and written in one statement at most once a second
 * (FLUSH_MS); a crash loses at most that second of counts. Withdrawal flushes first.
 */
const FLUSH_MS = 1000;
const pending = new Map<string, number>();
let timer: NodeJS.Timeout | null = null;

export function recordUsage({ userId, tokenId, versionId, evaluations }: { userId: number; tokenId: number | null; versionId: number; evaluations: number }) {
  const key = `${new Date().toISOString().slice(0, 10)}|${userId}|${tokenId ?? 0}|${versionId}`;
  pending.set(key, (pending.get(key) ?? 0) + evaluations);
  if (!timer) {
    timer = setTimeout(() => { void flushUsage().catch((err) => console.error('usage flush failed', err)); }, FLUSH_MS);
    timer.unref();
  }
}

/** Writes the gathered counts now (one multi-row upsert). */
export async function flushUsage(): Promise<void> {
  if (timer) { clearTimeout(timer); timer = null; }
  if (pending.size === 0) return;
  const rows = [...pending.entries()];
  pending.clear();
  const { sequelize } = db();
  try {
    await sequelize.query(
      `INSERT INTO usage_records (day, user_id, token_id, version_id, evaluations) VALUES ${rows.map(() => '(?, ?, ?, ?, ?)').join(', ')}
       ON DUPLICATE KEY UPDATE evaluations = evaluations + VALUES(evaluations)`,
      { replacements: rows.flatMap(([key, n]) => [...key.split('|').map((v, i) => (i === 0 ? v : Number(v))), n]), type: QueryTypes.INSERT },
    );
  } catch (err) {
    // Put the counts back so the next flush retries them.
    for (const [key, n] of rows) pending.set(key, (pending.get(key) ?? 0) + n);
    throw err;
  }
}
