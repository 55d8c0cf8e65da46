import { DataTypes, Model, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db.ts';

/** A scout assigned to walk a field. */
export class FieldAssignment extends Model<InferAttributes<FieldAssignment>, InferCreationAttributes<FieldAssignment>> {
  declare fieldId: string;
  declare userId: string;
}

FieldAssignment.init(
  {
    fieldId: { type: DataTypes.UUID, primaryKey: true },
    userId: { type: DataTypes.UUID, primaryKey: true },
  },
  { sequelize, tableName: 'field_assignments', updatedAt: false },
);
