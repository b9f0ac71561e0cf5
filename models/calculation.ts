import {
  DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize,
} from 'sequelize';
import { jsonColumn } from './json';

export const PROJECT_ROLES = ['editor', 'reviewer'] as const;
export type ProjectRole = (typeof PROJECT_ROLES)[number];

export class Project extends Model<InferAttributes<Project>, InferCreationAttributes<Project>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare description: string;
  declare ownerId: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class ProjectMember extends Model<InferAttributes<ProjectMember>, InferCreationAttributes<ProjectMember>> {
  declare projectId: number;
  declare userId: number;
  declare role: ProjectRole;
}

export class Calculation extends Model<InferAttributes<Calculation>, InferCreationAttributes<Calculation>> {
  declare id: CreationOptional<number>;
  declare projectId: number;
  declare title: string;
  declare ownerId: number;
  declare latestRevision: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class CalculationRevision extends Model<InferAttributes<CalculationRevision>, InferCreationAttributes<CalculationRevision>> {
  declare id: CreationOptional<number>;
  declare calculationId: number;
  declare revision: number;
  declare templateVersionId: number | null;
  declare content: unknown;
  declare contentHash: string;
  declare note: string;
  declare createdBy: number;
  declare createdAt: CreationOptional<Date>;
}

export class CalculationUse extends Model<InferAttributes<CalculationUse>, InferCreationAttributes<CalculationUse>> {
  declare revisionId: number;
  declare versionId: number;
}

export class TemplateDependency extends Model<InferAttributes<TemplateDependency>, InferCreationAttributes<TemplateDependency>> {
  declare templateVersionId: number;
  declare versionId: number;
}

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
// A fresh object each time: Sequelize writes the column name into the attribute definition it is given.
const fk = () => ({ type: DataTypes.INTEGER.UNSIGNED, allowNull: false });

export function initCalculation(sequelize: Sequelize) {
  Project.init({
    id, name: { type: DataTypes.STRING(160), allowNull: false }, description: { type: DataTypes.TEXT, allowNull: false },
    ownerId: fk(), createdAt: DataTypes.DATE(3), updatedAt: DataTypes.DATE(3),
  }, { sequelize, tableName: 'projects', underscored: true });
  ProjectMember.init({
    projectId: { ...fk(), primaryKey: true }, userId: { ...fk(), primaryKey: true }, role: { type: DataTypes.STRING(20), allowNull: false },
  }, { sequelize, tableName: 'project_members', underscored: true, timestamps: false });
  Calculation.init({
    id, projectId: fk(), title: { type: DataTypes.STRING(200), allowNull: false }, ownerId: fk(),
    latestRevision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false }, createdAt: DataTypes.DATE(3), updatedAt: DataTypes.DATE(3),
  }, { sequelize, tableName: 'calculations', underscored: true });
  CalculationRevision.init({
    id, calculationId: fk(), revision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    templateVersionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    content: jsonColumn('content'), contentHash: { type: DataTypes.CHAR(64), allowNull: false },
    note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' }, createdBy: fk(), createdAt: DataTypes.DATE(3),
  }, { sequelize, tableName: 'calculation_revisions', underscored: true, updatedAt: false });
  CalculationUse.init({
    revisionId: { ...fk(), primaryKey: true }, versionId: { ...fk(), primaryKey: true },
  }, { sequelize, tableName: 'calculation_uses', underscored: true, timestamps: false });
  TemplateDependency.init({
    templateVersionId: { ...fk(), primaryKey: true }, versionId: { ...fk(), primaryKey: true },
  }, { sequelize, tableName: 'template_dependencies', underscored: true, timestamps: false });
}
