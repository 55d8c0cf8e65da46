import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '../db.ts';
import type { DeliveryStatus } from '../../shared/schemas/notices.ts';

/** One grower contact's copy of a notice: delivery, link token (hash only) and reading. */
export class NoticeRecipient extends Model<InferAttributes<NoticeRecipient>, InferCreationAttributes<NoticeRecipient>> {
  declare id: CreationOptional<string>;
  declare noticeId: string;
  declare contactName: string;
  declare email: string;
  declare tokenHash: CreationOptional<string | null>;
  declare tokenExpiresAt: CreationOptional<Date | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare status: CreationOptional<DeliveryStatus>;
  declare attempts: CreationOptional<number>;
  declare lastError: CreationOptional<string | null>;
  /** Our own Message-ID header value, fixed when the copy is queued so every attempt sends the same one. */
  declare messageId: string;
  declare smtpAcceptedAt: CreationOptional<Date | null>;
  declare openedAt: CreationOptional<Date | null>;
  declare acknowledgedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

NoticeRecipient.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    noticeId: { type: DataTypes.UUID, allowNull: false },
    contactName: { type: DataTypes.TEXT, allowNull: false },
    email: { type: DataTypes.TEXT, allowNull: false },
    tokenHash: { type: DataTypes.TEXT, allowNull: true },
    tokenExpiresAt: { type: DataTypes.DATE, allowNull: true },
    revokedAt: { type: DataTypes.DATE, allowNull: true },
    status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'queued' },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    lastError: { type: DataTypes.TEXT, allowNull: true },
    messageId: { type: DataTypes.TEXT, allowNull: false },
    smtpAcceptedAt: { type: DataTypes.DATE, allowNull: true },
    openedAt: { type: DataTypes.DATE, allowNull: true },
    acknowledgedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'notice_recipients' },
);
