import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '../db.ts';
import type { Role } from '../../shared/schemas/roles.ts';
import type { UserView } from '../../shared/schemas/users.ts';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare name: string;
  declare email: string;
  declare passwordHash: string | null;
  declare role: Role;
  declare active: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;

  /** The shape every API answer uses: never the password hash. */
  toPublic(): UserView {
    return {
      id: this.id,
      organisationId: this.organisationId,
      name: this.name,
      email: this.email,
      role: this.role,
      active: this.active,
      invited: this.passwordHash === null,
    };
  }
}

User.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organisationId: { type: DataTypes.UUID, allowNull: false },
    name: { type: DataTypes.TEXT, allowNull: false },
    email: {
      type: DataTypes.TEXT,
      allowNull: false,
      set(value: string) {
        this.setDataValue('email', value.trim().toLowerCase());
      },
    },
    passwordHash: { type: DataTypes.TEXT, allowNull: true },
    role: { type: DataTypes.TEXT, allowNull: false },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'users' },
);
