import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';

export const name = '20261204000200-mail-claims';

/**
 * A message in the mail outbox is claimed before it is sent (status "sending", claimed_at), so that two deliveries
 * running at once — two approvals committing together, or two app instances — never send it twice. A claim older
 * than ten minutes (a process that died mid-send) may be taken again.
 */
export async function up(qi: QueryInterface): Promise<void> {
  await qi.addColumn('notifications', 'claimed_at', { type: DataTypes.DATE(3), allowNull: true });
  await qi.addIndex('notifications', ['status', 'claimed_at'], { name: 'notifications_status_claimed_at' });
}

export async function down(qi: QueryInterface): Promise<void> {
  // queryInterface.removeIndex/removeColumn issue untyped raw queries, which the mariadb connector rejects.
  await qi.sequelize.query('ALTER TABLE notifications DROP INDEX IF EXISTS notifications_status_claimed_at, DROP COLUMN IF EXISTS claimed_at', { type: QueryTypes.BULKDELETE });
}
