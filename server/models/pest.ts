import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '../db.ts';
import type { PestKind, ThresholdBasis } from '../../shared/schemas/pests.ts';

/** One entry of the organisation's pest library, with its action threshold and where it comes from. */
export class Pest extends Model<InferAttributes<Pest>, InferCreationAttributes<Pest>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare name: string;
  declare kind: PestKind;
  declare countUnit: string;
  declare actionThreshold: number;
  declare thresholdBasis: ThresholdBasis;
  declare thresholdNote: CreationOptional<string>;
  declare thresholdSource: string;
  declare active: CreationOptional<boolean>;
}

Pest.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organisationId: { type: DataTypes.UUID, allowNull: false },
    name: { type: DataTypes.TEXT, allowNull: false },
    kind: { type: DataTypes.TEXT, allowNull: false },
    countUnit: { type: DataTypes.TEXT, allowNull: false },
    actionThreshold: { type: DataTypes.DOUBLE, allowNull: false },
    thresholdBasis: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'mean' },
    thresholdNote: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    thresholdSource: { type: DataTypes.TEXT, allowNull: false },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
  },
  { sequelize, tableName: 'pests' },
);
