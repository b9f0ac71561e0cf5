import {
  DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize,
} from 'sequelize';
import { jsonColumn } from './json';

/** Append-only, hash-chained record of every state change. Never updated or deleted by the app. */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare at: Date;
  declare actorId: number | null;
  declare action: string;
  declare entityType: string;
  declare entityId: string;
  declare beforeHash: string | null;
  declare afterHash: string | null;
  declare details: Record<string, unknown>;
  declare prevHash: string;
  declare hash: string;
}

/** Outbox of e-mail notifications; the mailer delivers pending rows over SMTP. */
export class Notification extends Model<InferAttributes<Notification>, InferCreationAttributes<Notification>> {
  declare id: CreationOptional<number>;
  declare toEmail: string;
  declare subject: string;
  declare body: string;
  declare kind: string;
  declare versionId: number | null;
  declare status: 'pending' | 'sending' | 'sent' | 'failed';
  declare error: string | null;
  declare createdAt: CreationOptional<Date>;
  declare sentAt: Date | null;
  declare claimedAt: CreationOptional<Date | null>;
}

export class ApiToken extends Model<InferAttributes<ApiToken>, InferCreationAttributes<ApiToken>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare name: string;
  declare prefix: string;
  declare tokenHash: string;
  declare scopes: string;
  declare expiresAt: Date | null;
  declare revokedAt: Date | null;
  declare lastUsedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
}

/** An evidence document in object storage (bytes under object_key, named by their SHA-256). */
export class Attachment extends Model<InferAttributes<Attachment>, InferCreationAttributes<Attachment>> {
  declare id: string;
  declare sha256: string;
  declare mediaType: string;
  declare name: string;
  declare size: number;
  declare objectKey: string;
  declare uploadedBy: number;
  declare createdAt: CreationOptional<Date>;
}

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };

export function initRecords(sequelize: Sequelize) {
  Attachment.init(
    {
      id: { type: DataTypes.CHAR(36), primaryKey: true },
      sha256: { type: DataTypes.CHAR(64), allowNull: false },
      mediaType: { type: DataTypes.STRING(40), allowNull: false },
      name: { type: DataTypes.STRING(200), allowNull: false },
      size: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      objectKey: { type: DataTypes.STRING(200), allowNull: false },
      uploadedBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'attachments', underscored: true, updatedAt: false },
  );
  AuditEvent.init(
    {
      id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
      at: { type: DataTypes.DATE(3), allowNull: false },
      actorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      action: { type: DataTypes.STRING(60), allowNull: false },
      entityType: { type: DataTypes.STRING(40), allowNull: false },
      entityId: { type: DataTypes.STRING(60), allowNull: false },
      beforeHash: { type: DataTypes.CHAR(64), allowNull: true },
      afterHash: { type: DataTypes.CHAR(64), allowNull: true },
      details: jsonColumn('details'),
      prevHash: { type: DataTypes.CHAR(64), allowNull: false },
      hash: { type: DataTypes.CHAR(64), allowNull: false },
    },
    { sequelize, tableName: 'audit_events', underscored: true, timestamps: false },
  );
  Notification.init(
    {
      id,
      toEmail: { type: DataTypes.STRING(190), allowNull: false },
      subject: { type: DataTypes.STRING(300), allowNull: false },
      body: { type: DataTypes.TEXT, allowNull: false },
      kind: { type: DataTypes.STRING(40), allowNull: false },
      versionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      status: { type: DataTypes.STRING(20), allowNull: false },
      error: { type: DataTypes.TEXT, allowNull: true },
      createdAt: DataTypes.DATE(3),
      sentAt: { type: DataTypes.DATE(3), allowNull: true },
      claimedAt: { type: DataTypes.DATE(3), allowNull: true },
    },
    { sequelize, tableName: 'notifications', underscored: true, updatedAt: false },
  );
  ApiToken.init(
    {
      id,
      userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      name: { type: DataTypes.STRING(100), allowNull: false },
      prefix: { type: DataTypes.STRING(16), allowNull: false },
      tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
      scopes: { type: DataTypes.STRING(100), allowNull: false },
      expiresAt: { type: DataTypes.DATE(3), allowNull: true },
      revokedAt: { type: DataTypes.DATE(3), allowNull: true },
      lastUsedAt: { type: DataTypes.DATE(3), allowNull: true },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'api_tokens', underscored: true, updatedAt: false },
  );
}
