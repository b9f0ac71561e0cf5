import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';

export const name = '20261202000100-templates-projects-calculations';

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
const ref = (model: string, allowNull = false, onDelete?: string) => ({
  type: DataTypes.INTEGER.UNSIGNED, allowNull, references: { model, key: 'id' }, ...(onDelete ? { onDelete } : {}),
});
const json = (allowNull = false) => ({ type: DataTypes.TEXT('long'), allowNull });
const at = (allowNull = false) => ({ type: DataTypes.DATE(3), allowNull });

export async function up(qi: QueryInterface): Promise<void> {
  // A calculation template is governed like a correlation (versions, validation, four-eyes sign-off,
  // withdrawal); `kind` tells the two apart in the one life cycle.
  await qi.addColumn('correlations', 'kind', { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'correlation' });
  await qi.addIndex('correlations', ['kind']);

  // Which correlation versions a template version pins (filled on submission): "what uses this version".
  await qi.createTable('template_dependencies', {
    template_version_id: { ...ref('correlation_versions', false, 'CASCADE'), primaryKey: true },
    version_id: { ...ref('correlation_versions', false, 'CASCADE'), primaryKey: true },
  });
  await qi.addIndex('template_dependencies', ['version_id']);

  await qi.createTable('projects', {
    id,
    name: { type: DataTypes.STRING(160), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: false },
    owner_id: ref('users'),
    created_at: at(),
    updated_at: at(),
  });
  await qi.createTable('project_members', {
    project_id: { ...ref('projects', false, 'CASCADE'), primaryKey: true },
    user_id: { ...ref('users', false, 'CASCADE'), primaryKey: true },
    role: { type: DataTypes.STRING(20), allowNull: false },
  });
  await qi.addIndex('project_members', ['user_id']);

  await qi.createTable('calculations', {
    id,
    project_id: ref('projects', false, 'CASCADE'),
    title: { type: DataTypes.STRING(200), allowNull: false },
    owner_id: ref('users'),
    latest_revision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    created_at: at(),
    updated_at: at(),
  });
  await qi.addIndex('calculations', ['project_id']);

  // A saved revision never changes: its content (chain, inputs, every intermediate result, versions,
  // hashes, engine version) is frozen under a content hash; a change is a new revision.
  await qi.createTable('calculation_revisions', {
    id,
    calculation_id: ref('calculations', false, 'CASCADE'),
    revision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    template_version_id: ref('correlation_versions', true),
    content: json(),
    content_hash: { type: DataTypes.CHAR(64), allowNull: false },
    note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    created_by: ref('users'),
    created_at: at(),
  });
  await qi.addIndex('calculation_revisions', ['calculation_id', 'revision'], { unique: true });

  await qi.createTable('calculation_uses', {
    revision_id: { ...ref('calculation_revisions', false, 'CASCADE'), primaryKey: true },
    version_id: { ...ref('correlation_versions', false, 'CASCADE'), primaryKey: true },
  });
  await qi.addIndex('calculation_uses', ['version_id']);
}

export async function down(qi: QueryInterface): Promise<void> {
  for (const table of ['calculation_uses', 'calculation_revisions', 'calculations', 'project_members', 'projects', 'template_dependencies']) {
    await qi.dropTable(table);
  }
  // queryInterface.removeColumn issues an untyped raw query, which the mariadb connector rejects; the
  // typed statement drops the column and its index.
  await qi.sequelize.query('ALTER TABLE correlations DROP COLUMN kind', { type: QueryTypes.BULKDELETE });
}
