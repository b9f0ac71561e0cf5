import { DataTypes, type QueryInterface } from 'sequelize';

export const name = '20261201000300-api-tokens-usage-rate-limits';

export async function up(qi: QueryInterface): Promise<void> {
  await qi.createTable('api_tokens', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    user_id: {
      type: DataTypes.INTEGER.UNSIGNED, allowNull: false,
      references: { model: 'users', key: 'id' }, onDelete: 'CASCADE',
    },
    name: { type: DataTypes.STRING(100), allowNull: false },
    prefix: { type: DataTypes.STRING(16), allowNull: false },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    scopes: { type: DataTypes.STRING(100), allowNull: false },
    expires_at: { type: DataTypes.DATE(3), allowNull: true },
    revoked_at: { type: DataTypes.DATE(3), allowNull: true },
    last_used_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('api_tokens', ['user_id']);

  // One row per day × user × token (0 = browser session) × correlation version.
  await qi.createTable('usage_records', {
    day: { type: DataTypes.DATEONLY, allowNull: false, primaryKey: true },
    user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
    token_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
    version_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true },
    evaluations: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
  });
  await qi.addIndex('usage_records', ['version_id']);

  // Fixed-window counters shared by every app instance on the same database.
  await qi.createTable('rate_limit_windows', {
    bucket: { type: DataTypes.STRING(80), allowNull: false, primaryKey: true },
    window_start: { type: DataTypes.BIGINT, allowNull: false, primaryKey: true },
    hits: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
  });
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('rate_limit_windows');
  await qi.dropTable('usage_records');
  await qi.dropTable('api_tokens');
}
