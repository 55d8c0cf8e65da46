import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '../db.ts';

export class UserToken extends Model<InferAttributes<UserToken>, InferCreationAttributes<UserToken>> {
  declare id: CreationOptional<string>;
  declare userId: string;
  declare purpose: 'invite' | 'reset';
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: Date | null;
}

UserToken.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    userId: { type: DataTypes.UUID, allowNull: false },
    purpose: { type: DataTypes.TEXT, allowNull: false },
    tokenHash: { type: DataTypes.TEXT, allowNull: false },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    usedAt: { type: DataTypes.DATE, allowNull: true },
  },
  { sequelize, tableName: 'user_tokens' },
);
