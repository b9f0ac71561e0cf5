import { QueryTypes } from 'sequelize';
import { db } from '@/models';
import { appendAuditEvent } from '@/lib/audit/log';

/** A setting an admin keeps (a JSON value under its key in `settings`), or undefined when none was saved. */
export async function readSetting<T>(key: string): Promise<T | undefined> {
  const [row] = await db().sequelize.query<{ value: string }>('SELECT value FROM settings WHERE `key` = ?', { replacements: [key], type: QueryTypes.SELECT });
  return row ? (JSON.parse(row.value) as T) : undefined;
}

/** Saves a setting and records the change, before and after, in the audit trail — in one transaction. */
export async function saveSetting<T>({ key, value, before, actorId, action }: { key: string; value: T; before: T; actorId: number | null; action: string }): Promise<void> {
  const { sequelize } = db();
  await sequelize.transaction(async (transaction) => {
    await sequelize.query('INSERT INTO settings (`key`, value, updated_at) VALUES (?, ?, ?) ON DUPLICATE KEY UPDATE value = VALUES(value), updated_at = VALUES(updated_at)',
      { replacements: [key, JSON.stringify(value), new Date()], type: QueryTypes.INSERT, transaction });
    await appendAuditEvent({ transaction, event: { actorId, action, entityType: 'setting', entityId: key, details: { before, after: value } } });
  });
}
