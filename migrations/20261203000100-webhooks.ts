import { DataTypes, type QueryInterface } from 'sequelize';

export const name = '20261203000100-webhooks';

/**
 * Webhooks: endpoints an integrator registers (URL, events, the correlations they follow, a signing secret)
 * and an outbox of deliveries written in the same transaction as the change they report, sent by the
 * dispatcher with retries (lib/webhooks). The allow-list of URL prefixes lives in `settings`.
 */
export async function up(qi: QueryInterface): Promise<void> {
  await qi.createTable('webhook_endpoints', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    url: { type: DataTypes.STRING(500), allowNull: false },
    events: { type: DataTypes.TEXT, allowNull: false },
    slugs: { type: DataTypes.TEXT, allowNull: true },
    secret: { type: DataTypes.STRING(100), allowNull: false },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    deleted_at: { type: DataTypes.DATE(3), allowNull: true },
  });
  await qi.addIndex('webhook_endpoints', ['user_id']);
  await qi.createTable('webhook_deliveries', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    endpoint_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'webhook_endpoints', key: 'id' }, onDelete: 'CASCADE' },
    event: { type: DataTypes.STRING(40), allowNull: false },
    body: { type: DataTypes.TEXT('medium'), allowNull: false },
    status: { type: DataTypes.STRING(12), allowNull: false },
    attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    next_attempt_at: { type: DataTypes.DATE(3), allowNull: false },
    last_status: { type: DataTypes.INTEGER, allowNull: true },
    last_error: { type: DataTypes.STRING(500), allowNull: true },
    delivered_at: { type: DataTypes.DATE(3), allowNull: true },
    replay_of: { type: DataTypes.BIGINT.UNSIGNED, allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('webhook_deliveries', ['status', 'next_attempt_at']);
  await qi.addIndex('webhook_deliveries', ['endpoint_id', 'id']);
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('webhook_deliveries');
  await qi.dropTable('webhook_endpoints');
}
