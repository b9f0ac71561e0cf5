import {
  DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes,
  type NonAttribute, type Sequelize,
} from 'sequelize';
import { jsonColumn } from './json';

export const VERSION_STATUSES = ['draft', 'in_review', 'approved', 'superseded', 'returned', 'withdrawn'] as const;
export type VersionStatus = (typeof VERSION_STATUSES)[number];

export const ENTRY_KINDS = ['correlation', 'template'] as const;
export type EntryKind = (typeof ENTRY_KINDS)[number];

export class Correlation extends Model<InferAttributes<Correlation>, InferCreationAttributes<Correlation>> {
  declare id: CreationOptional<number>;
  declare slug: string;
  /** A correlation, or a calculation template governed by the same life cycle. */
  declare kind: CreationOptional<EntryKind>;
  declare title: string;
  declare category: string;
  declare situation: CreationOptional<string>;
  declare tags: string[];
  declare ownerId: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare versions?: NonAttribute<CorrelationVersion[]>;
}

export class CorrelationVersion extends Model<
  InferAttributes<CorrelationVersion>, InferCreationAttributes<CorrelationVersion>
> {
  declare id: CreationOptional<number>;
  declare correlationId: number;
  declare version: number;
  declare status: VersionStatus;
  declare definition: unknown;
  declare contentHash: string | null;
  declare authorId: number;
  declare submittedAt: Date | null;
  declare approvedAt: Date | null;
  declare approvedById: number | null;
  declare returnedAt: Date | null;
  declare supersededAt: Date | null;
  declare withdrawnAt: Date | null;
  declare withdrawnReason: string | null;
  /** Evidence grade computed at submission (lib/engine/evidence.ts). */
  declare evidenceGrade: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare correlation?: NonAttribute<Correlation>;
  declare checkCases?: NonAttribute<CheckCaseRow[]>;
}

export class CheckCaseRow extends Model<InferAttributes<CheckCaseRow>, InferCreationAttributes<CheckCaseRow>> {
  declare id: CreationOptional<number>;
  declare versionId: number;
  declare position: number;
  declare label: string;
  declare body: unknown;
}

export class ValidationRun extends Model<InferAttributes<ValidationRun>, InferCreationAttributes<ValidationRun>> {
  declare id: CreationOptional<number>;
  declare versionId: number;
  declare engineVersion: string;
  declare passed: boolean;
  declare report: unknown;
  declare createdAt: CreationOptional<Date>;
}

export class SignOff extends Model<InferAttributes<SignOff>, InferCreationAttributes<SignOff>> {
  declare id: CreationOptional<number>;
  declare versionId: number;
  declare userId: number;
  declare decision: 'approved' | 'returned' | 'withdrawn';
  declare comment: string;
  declare meaning: string;
  declare contentHash: string | null;
  /** Why an approver signed a version below the evidence policy. */
  declare waiver: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
}

export class VersionComment extends Model<InferAttributes<VersionComment>, InferCreationAttributes<VersionComment>> {
  declare id: CreationOptional<number>;
  declare versionId: number;
  declare userId: number;
  declare body: string;
  declare createdAt: CreationOptional<Date>;
}

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
const createdOnly = { underscored: true, createdAt: 'createdAt', updatedAt: false } as const;

export function initCorrelation(sequelize: Sequelize) {
  Correlation.init(
    {
      id,
      slug: { type: DataTypes.STRING(100), allowNull: false, unique: true },
      kind: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'correlation' },
      title: { type: DataTypes.STRING(200), allowNull: false },
      category: { type: DataTypes.STRING(40), allowNull: false },
      situation: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
      tags: jsonColumn('tags'),
      ownerId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'correlations', underscored: true },
  );
  CorrelationVersion.init(
    {
      id,
      correlationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      status: { type: DataTypes.STRING(20), allowNull: false },
      definition: jsonColumn('definition'),
      contentHash: { type: DataTypes.CHAR(64), allowNull: true },
      authorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      submittedAt: { type: DataTypes.DATE(3), allowNull: true },
      approvedAt: { type: DataTypes.DATE(3), allowNull: true },
      approvedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      returnedAt: { type: DataTypes.DATE(3), allowNull: true },
      supersededAt: { type: DataTypes.DATE(3), allowNull: true },
      withdrawnAt: { type: DataTypes.DATE(3), allowNull: true },
      withdrawnReason: { type: DataTypes.TEXT, allowNull: true },
      evidenceGrade: { type: DataTypes.STRING(20), allowNull: true },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'correlation_versions', underscored: true },
  );
  CheckCaseRow.init(
    {
      id,
      versionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      label: { type: DataTypes.STRING(200), allowNull: false },
      body: jsonColumn('body'),
    },
    { sequelize, tableName: 'check_cases', underscored: true, timestamps: false },
  );
  ValidationRun.init(
    {
      id,
      versionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      engineVersion: { type: DataTypes.STRING(20), allowNull: false },
      passed: { type: DataTypes.BOOLEAN, allowNull: false },
      report: jsonColumn('report'),
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'validation_runs', ...createdOnly },
  );
  SignOff.init(
    {
      id,
      versionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      decision: { type: DataTypes.STRING(20), allowNull: false },
      comment: { type: DataTypes.TEXT, allowNull: false },
      meaning: { type: DataTypes.STRING(300), allowNull: false },
      contentHash: { type: DataTypes.CHAR(64), allowNull: true },
      waiver: { type: DataTypes.TEXT, allowNull: true },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'sign_offs', ...createdOnly },
  );
  VersionComment.init(
    {
      id,
      versionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      body: { type: DataTypes.TEXT, allowNull: false },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'version_comments', ...createdOnly },
  );
}
