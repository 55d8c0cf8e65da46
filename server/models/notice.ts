import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '../db.ts';
import type { NoticeMaterial, NoticeStatus } from '../../shared/schemas/notices.ts';

/** A zone notice: the adviser's message to a farm's grower contacts about one zone set. */
export class Notice extends Model<InferAttributes<Notice>, InferCreationAttributes<Notice>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare fieldId: string;
  declare zoneSetId: string;
  declare checkId: string | null;
  declare pestId: string;
  declare recommendation: string;
  /** YYYY-MM-DD */
  declare rescoutOn: string | null;
  declare status: CreationOptional<NoticeStatus>;
  declare createdBy: string;
  declare sentAt: CreationOptional<Date | null>;
  /** The snapshot of what the notice showed when it was sent; null for drafts. */
  declare material: CreationOptional<NoticeMaterial | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Notice.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organisationId: { type: DataTypes.UUID, allowNull: false },
    fieldId: { type: DataTypes.UUID, allowNull: false },
    zoneSetId: { type: DataTypes.UUID, allowNull: false },
    checkId: { type: DataTypes.UUID, allowNull: true },
    pestId: { type: DataTypes.UUID, allowNull: false },
    recommendation: { type: DataTypes.TEXT, allowNull: false },
    rescoutOn: { type: DataTypes.DATEONLY, allowNull: true },
    status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'draft' },
    createdBy: { type: DataTypes.UUID, allowNull: false },
    sentAt: { type: DataTypes.DATE, allowNull: true },
    material: { type: DataTypes.JSONB, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'notices' },
);
