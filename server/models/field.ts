import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import type { MultiPolygon } from 'geojson';
import { sequelize } from '../db.ts';

export class Field extends Model<InferAttributes<Field>, InferCreationAttributes<Field>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare farmId: string;
  declare name: string;
  declare crop: string;
  declare season: number;
  declare boundary: MultiPolygon;
  /** Set by the database trigger on every save (ellipsoidal area). */
  declare areaM2: CreationOptional<number>;
}

Field.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organisationId: { type: DataTypes.UUID, allowNull: false },
    farmId: { type: DataTypes.UUID, allowNull: false },
    name: { type: DataTypes.TEXT, allowNull: false },
    crop: { type: DataTypes.TEXT, allowNull: false },
    season: { type: DataTypes.INTEGER, allowNull: false },
    boundary: { type: DataTypes.GEOMETRY('MULTIPOLYGON', 4326), allowNull: false },
    areaM2: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
  },
  { sequelize, tableName: 'fields' },
);
