import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type NonAttribute } from 'sequelize';
import { sequelize } from '../db.ts';
import type { FarmContact } from './farm-contact.ts';

export class Farm extends Model<InferAttributes<Farm>, InferCreationAttributes<Farm>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare name: string;
  declare contacts?: NonAttribute<FarmContact[]>;
}

Farm.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organisationId: { type: DataTypes.UUID, allowNull: false },
    name: { type: DataTypes.TEXT, allowNull: false },
  },
  { sequelize, tableName: 'farms' },
);
