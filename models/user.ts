import {
  DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes,
  type NonAttribute, type Sequelize,
} from 'sequelize';

export const ROLES = ['admin', 'author', 'approver', 'engineer', 'integrator'] as const;
export type Role = (typeof ROLES)[number];

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare name: string;
  declare passwordHash: string;
  declare isActive: CreationOptional<boolean>;
  declare failedLogins: CreationOptional<number>;
  declare lockedUntil: Date | null;
  /** Sessions carry the number they were issued under; bumping it ends them all. */
  declare sessionVersion: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare roles?: NonAttribute<UserRole[]>;

  roleNames(): Role[] {
    return (this.roles ?? []).map((r) => r.role).sort();
  }
}

export class UserRole extends Model<InferAttributes<UserRole>, InferCreationAttributes<UserRole>> {
  declare userId: number;
  declare role: Role;
}

export function initUser(sequelize: Sequelize) {
  User.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      email: { type: DataTypes.STRING(190), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      passwordHash: { type: DataTypes.STRING(100), allowNull: false },
      isActive: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      failedLogins: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      lockedUntil: { type: DataTypes.DATE(3), allowNull: true },
      sessionVersion: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'users', underscored: true },
  );
  UserRole.init(
    {
      userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
      role: { type: DataTypes.STRING(20), primaryKey: true },
    },
    { sequelize, tableName: 'user_roles', underscored: true, timestamps: false },
  );
}
