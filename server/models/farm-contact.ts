import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '../db.ts';

/** A grower contact who receives zone notices for a farm. */
export class FarmContact extends Model<InferAttributes<FarmContact>, InferCreationAttributes<FarmContact>> {
  declare id: CreationOptional<string>;
  declare farmId: string;
  declare name: string;
  declare email: string;
}

FarmContact.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    farmId: { type: DataTypes.UUID, allowNull: false },
    name: { type: DataTypes.TEXT, allowNull: false },
    email: {
      type: DataTypes.TEXT,
      allowNull: false,
      set(value: string) {
        this.setDataValue('email', value.trim().toLowerCase());
      },
    },
  },
  { sequelize, tableName: 'farm_contacts' },
);
