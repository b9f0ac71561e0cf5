import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';

export const name = '20261202000300-evidence-policy';

export async function up(qi: QueryInterface): Promise<void> {
  // The evidence grade computed at submission (lib/engine/evidence.ts), for the library list and its filter.
  await qi.addColumn('correlation_versions', 'evidence_grade', { type: DataTypes.STRING(20), allowNull: true });
  await qi.addIndex('correlation_versions', ['evidence_grade']);
  // An approval below the evidence policy records why the approver signed anyway.
  await qi.addColumn('sign_offs', 'waiver', { type: DataTypes.TEXT, allowNull: true });
  // Settings an admin changes at run time (the evidence policy), one JSON value per key.
  await qi.createTable('settings', {
    key: { type: DataTypes.STRING(60), allowNull: false, primaryKey: true },
    value: { type: DataTypes.TEXT, allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('settings');
  await qi.sequelize.query('ALTER TABLE sign_offs DROP COLUMN waiver', { type: QueryTypes.BULKDELETE });
  await qi.sequelize.query('ALTER TABLE correlation_versions DROP COLUMN evidence_grade', { type: QueryTypes.BULKDELETE });
}
