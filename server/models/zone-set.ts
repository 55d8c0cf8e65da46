import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '../db.ts';
import type { ZoneSetStatus } from '../../shared/schemas/zones.ts';

/** One version of a field's treatment zones for one pest. */
export class ZoneSet extends Model<InferAttributes<ZoneSet>, InferCreationAttributes<ZoneSet>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare fieldId: string;
  declare checkId: string | null;
  declare pestId: string;
  declare version: number;
  declare status: CreationOptional<ZoneSetStatus>;
  declare createdBy: string;
  declare acceptedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

ZoneSet.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organisationId: { type: DataTypes.UUID, allowNull: false },
    fieldId: { type: DataTypes.UUID, allowNull: false },
    checkId: { type: DataTypes.UUID, allowNull: true },
    pestId: { type: DataTypes.UUID, allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false },
    status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'draft' },
    createdBy: { type: DataTypes.UUID, allowNull: false },
    acceptedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'zone_sets' },
);
