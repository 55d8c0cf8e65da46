import { DataTypes, Model, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db.ts';

/** A grower account that may see a farm (read-only). */
export class FarmGrower extends Model<InferAttributes<FarmGrower>, InferCreationAttributes<FarmGrower>> {
  declare farmId: string;
  declare userId: string;
}

FarmGrower.init(
  {
    farmId: { type: DataTypes.UUID, primaryKey: true },
    userId: { type: DataTypes.UUID, primaryKey: true },
  },
  { sequelize, tableName: 'farm_growers', updatedAt: false },
);
