import { DataTypes, type QueryInterface } from 'sequelize';

export const name = '20261201000100-users-and-roles';

export async function up(qi: QueryInterface): Promise<void> {
  await qi.createTable('users', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(190), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    password_hash: { type: DataTypes.STRING(100), allowNull: false },
    is_active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    failed_logins: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    locked_until: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.createTable('user_roles', {
    user_id: {
      type: DataTypes.INTEGER.UNSIGNED, allowNull: false, primaryKey: true,
      references: { model: 'users', key: 'id' }, onDelete: 'CASCADE',
    },
    role: { type: DataTypes.STRING(20), allowNull: false, primaryKey: true },
  });
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('user_roles');
  await qi.dropTable('users');
}
