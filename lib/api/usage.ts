import { QueryTypes } from 'sequelize';
import { db } from '@/models';

/**
 * Counts evaluations per day × user × token (0 = browser session) × version. These rows answer
 * "who used this version" when it is withdrawn.
 */
export async function recordUsage({ userId, tokenId, versionId, evaluations }: { userId: number; tokenId: number | null; versionId: number; evaluations: number }) {
  const { sequelize } = db();
  const day = new Date().toISOString().slice(0, 10);
  await sequelize.query(
    `INSERT INTO usage_records (day, user_id, token_id, version_id, evaluations) VALUES (?, ?, ?, ?, ?)
     ON DUPLICATE KEY UPDATE evaluations = evaluations + VALUES(evaluations)`,
    { replacements: [day, userId, tokenId ?? 0, versionId, evaluations], type: QueryTypes.INSERT },
  );
}

export async function usageOfVersion({ versionId }: { versionId: number }) {
  const { sequelize } = db();
  return sequelize.query<{ day: string; user_id: number; token_id: number; evaluations: number }>(
    'SELECT day, user_id, token_id, evaluations FROM usage_records WHERE version_id = ? ORDER BY day DESC',
    { replacements: [versionId], type: QueryTypes.SELECT },
  );
}
