import { DataTypes, type QueryInterface } from 'sequelize';

export const name = '20261201000200-correlations-and-versions';

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
const userRef = (allowNull: boolean) => ({
  type: DataTypes.INTEGER.UNSIGNED, allowNull, references: { model: 'users', key: 'id' },
});
const versionRef = {
  type: DataTypes.INTEGER.UNSIGNED, allowNull: false,
  references: { model: 'correlation_versions', key: 'id' }, onDelete: 'CASCADE',
};
const json = (allowNull = false) => ({ type: DataTypes.TEXT('long'), allowNull });
const at = (allowNull = false) => ({ type: DataTypes.DATE(3), allowNull });

export async function up(qi: QueryInterface): Promise<void> {
  await qi.createTable('correlations', {
    id,
    slug: { type: DataTypes.STRING(100), allowNull: false, unique: true },
    title: { type: DataTypes.STRING(200), allowNull: false },
    category: { type: DataTypes.STRING(40), allowNull: false },
    situation: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
    tags: json(),
    owner_id: userRef(false),
    created_at: at(),
    updated_at: at(),
  });
  await qi.addIndex('correlations', ['category']);

  await qi.createTable('correlation_versions', {
    id,
    correlation_id: {
      type: DataTypes.INTEGER.UNSIGNED, allowNull: false,
      references: { model: 'correlations', key: 'id' }, onDelete: 'CASCADE',
    },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    status: { type: DataTypes.STRING(20), allowNull: false },
    definition: json(),
    content_hash: { type: DataTypes.CHAR(64), allowNull: true },
    author_id: userRef(false),
    submitted_at: at(true),
    approved_at: at(true),
    approved_by_id: userRef(true),
    returned_at: at(true),
    superseded_at: at(true),
    withdrawn_at: at(true),
    withdrawn_reason: { type: DataTypes.TEXT, allowNull: true },
    created_at: at(),
    updated_at: at(),
  });
  await qi.addIndex('correlation_versions', ['correlation_id', 'version'], { unique: true });
  await qi.addIndex('correlation_versions', ['status']);
  await qi.addIndex('correlation_versions', ['author_id']);

  await qi.createTable('check_cases', {
    id,
    version_id: versionRef,
    position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    label: { type: DataTypes.STRING(200), allowNull: false },
    body: json(),
  });
  await qi.addIndex('check_cases', ['version_id', 'position'], { unique: true });

  await qi.createTable('validation_runs', {
    id,
    version_id: versionRef,
    engine_version: { type: DataTypes.STRING(20), allowNull: false },
    passed: { type: DataTypes.BOOLEAN, allowNull: false },
    report: json(),
    created_at: at(),
  });
  await qi.addIndex('validation_runs', ['version_id']);

  await qi.createTable('sign_offs', {
    id,
    version_id: versionRef,
    user_id: userRef(false),
    decision: { type: DataTypes.STRING(20), allowNull: false },
    comment: { type: DataTypes.TEXT, allowNull: false },
    meaning: { type: DataTypes.STRING(300), allowNull: false },
    content_hash: { type: DataTypes.CHAR(64), allowNull: true },
    created_at: at(),
  });
  await qi.addIndex('sign_offs', ['version_id']);

  await qi.createTable('version_comments', {
    id,
    version_id: versionRef,
    user_id: userRef(false),
    body: { type: DataTypes.TEXT, allowNull: false },
    created_at: at(),
  });
  await qi.addIndex('version_comments', ['version_id']);

  await qi.createTable('audit_events', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    at: at(),
    actor_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    action: { type: DataTypes.STRING(60), allowNull: false },
    entity_type: { type: DataTypes.STRING(40), allowNull: false },
    entity_id: { type: DataTypes.STRING(60), allowNull: false },
    before_hash: { type: DataTypes.CHAR(64), allowNull: true },
    after_hash: { type: DataTypes.CHAR(64), allowNull: true },
    details: json(),
    prev_hash: { type: DataTypes.CHAR(64), allowNull: false },
    hash: { type: DataTypes.CHAR(64), allowNull: false },
  });
  await qi.addIndex('audit_events', ['entity_type', 'entity_id']);
  // One row holding the chain's head; appending locks it, so events are chained strictly in order.
  await qi.createTable('audit_chain_head', {
    id: { type: DataTypes.TINYINT.UNSIGNED, primaryKey: true },
    last_hash: { type: DataTypes.CHAR(64), allowNull: false },
  });
  await qi.bulkInsert('audit_chain_head', [{ id: 1, last_hash: '0'.repeat(64) }]);

  await qi.createTable('notifications', {
    id,
    to_email: { type: DataTypes.STRING(190), allowNull: false },
    subject: { type: DataTypes.STRING(300), allowNull: false },
    body: { type: DataTypes.TEXT, allowNull: false },
    kind: { type: DataTypes.STRING(40), allowNull: false },
    version_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    status: { type: DataTypes.STRING(20), allowNull: false },
    error: { type: DataTypes.TEXT, allowNull: true },
    created_at: at(),
    sent_at: at(true),
  });
  await qi.addIndex('notifications', ['status']);
}

export async function down(qi: QueryInterface): Promise<void> {
  for (const table of ['notifications', 'audit_chain_head', 'audit_events', 'version_comments', 'sign_offs', 'validation_runs',
    'check_cases', 'correlation_versions', 'correlations']) {
    await qi.dropTable(table);
  }
}
