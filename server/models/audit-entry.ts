import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '../db.ts';

/** One line of the audit log: who changed what. */
export class AuditEntry extends Model<InferAttributes<AuditEntry>, InferCreationAttributes<AuditEntry>> {
  declare id: CreationOptional<number>;
  declare organisationId: string | null;
  declare userId: string | null;
  declare action: string;
  declare entity: string;
  declare entityId: string | null;
  declare changes: CreationOptional<Record<string, unknown>>;
  declare createdAt: CreationOptional<Date>;
}

AuditEntry.init(
  {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    organisationId: { type: DataTypes.UUID, allowNull: true },
    userId: { type: DataTypes.UUID, allowNull: true },
    action: { type: DataTypes.TEXT, allowNull: false },
    entity: { type: DataTypes.TEXT, allowNull: false },
    entityId: { type: DataTypes.TEXT, allowNull: true },
    changes: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'audit_log', updatedAt: false },
);
