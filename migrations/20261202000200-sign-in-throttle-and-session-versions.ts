import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';

export const name = '20261202000200-sign-in-throttle-and-session-versions';

export async function up(qi: QueryInterface): Promise<void> {
  // Bumped by a password change, "sign out everywhere", deactivation and a role change: every session
  // issued before carries the old number and is refused.
  await qi.addColumn('users', 'session_version', { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 });
  // Failed password checks per bucket (account × client address, account, client address, a person's
  // sign-off password), with growing delays instead of a lock-out anyone could trigger.
  await qi.createTable('password_throttle', {
    bucket: { type: DataTypes.CHAR(64), allowNull: false, primaryKey: true },
    failures: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    last_failure_at: { type: DataTypes.BIGINT, allowNull: false },
  });
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('password_throttle');
  await qi.sequelize.query('ALTER TABLE users DROP COLUMN session_version', { type: QueryTypes.BULKDELETE });
}
