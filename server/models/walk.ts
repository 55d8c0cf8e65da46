import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '../db.ts';

/** One scouting visit to one field on one day by one scout. */
export class Walk extends Model<InferAttributes<Walk>, InferCreationAttributes<Walk>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare fieldId: string;
  declare scoutId: string;
  /** YYYY-MM-DD (DATEONLY) */
  declare walkedOn: string;
  declare notes: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Walk.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organisationId: { type: DataTypes.UUID, allowNull: false },
    fieldId: { type: DataTypes.UUID, allowNull: false },
    scoutId: { type: DataTypes.UUID, allowNull: false },
    walkedOn: { type: DataTypes.DATEONLY, allowNull: false },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'walks' },
);
