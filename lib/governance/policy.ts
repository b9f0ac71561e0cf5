import { QueryTypes } from 'sequelize';
import { db } from '@/models';
import { AppError } from '@/lib/http/errors';
import type { AuthUser } from '@/lib/auth/users';
import { appendAuditEvent } from '@/lib/audit/log';
import { DEFAULT_POLICY, type EvidencePolicy } from '@/lib/engine/evidence';

const KEY = 'evidence-policy';

/** The evidence policy in force: what an admin set, else the default (3 independent checks of 2 kinds). */
export async function evidencePolicy(): Promise<EvidencePolicy> {
  const [row] = await db().sequelize.query<{ value: string }>('SELECT value FROM settings WHERE `key` = ?', { replacements: [KEY], type: QueryTypes.SELECT });
  return row ? { ...DEFAULT_POLICY, ...(JSON.parse(row.value) as Partial<EvidencePolicy>) } : DEFAULT_POLICY;
}

export async function setEvidencePolicy({ actor, policy }: { actor: AuthUser; policy: EvidencePolicy }) {
  if (!actor.roles.includes('admin')) throw new AppError('forbidden:role', 'Only an admin changes the evidence policy.');
  const before = await evidencePolicy();
  const { sequelize } = db();
  await sequelize.transaction(async (transaction) => {
    await sequelize.query('INSERT INTO settings (`key`, value, updated_at) VALUES (?, ?, ?) ON DUPLICATE KEY UPDATE value = VALUES(value), updated_at = VALUES(updated_at)',
      { replacements: [KEY, JSON.stringify(policy), new Date()], type: QueryTypes.INSERT, transaction });
    await appendAuditEvent({ transaction, event: { actorId: actor.id, action: 'policy.evidence-changed', entityType: 'setting', entityId: KEY, details: { before, after: policy } } });
  });
  return policy;
}
