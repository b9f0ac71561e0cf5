import { DataTypes, type QueryInterface } from 'sequelize';

export const name = '20261205000100-attachments';

/**
 * Evidence documents (a PDF excerpt or a scan of a table page) behind a reference or a check case. The bytes live in
 * object storage under their SHA-256; this table keeps who uploaded what, its detected type and size. A check case
 * refers to one by { id, sha256, mediaType, name }, which is part of the version's content hash.
 */
export async function up(qi: QueryInterface): Promise<void> {
  await qi.createTable('attachments', {
    id: { type: DataTypes.CHAR(36), primaryKey: true },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    media_type: { type: DataTypes.STRING(40), allowNull: false },
    name: { type: DataTypes.STRING(200), allowNull: false },
    size: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    object_key: { type: DataTypes.STRING(200), allowNull: false },
    uploaded_by: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' } },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('attachments', ['uploaded_by']);
  await qi.addIndex('attachments', ['sha256']);
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('attachments');
}
