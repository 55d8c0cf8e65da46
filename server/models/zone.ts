import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import type { MultiPolygon } from 'geojson';
import { sequelize } from '../db.ts';

/** One treatment zone of a zone set; its area is set by the database trigger (ellipsoidal). */
export class Zone extends Model<InferAttributes<Zone>, InferCreationAttributes<Zone>> {
  declare id: CreationOptional<string>;
  declare zoneSetId: string;
  declare position: number;
  declare label: string;
  declare geometry: MultiPolygon;
  declare areaM2: CreationOptional<number>;
  declare shareOfField: number;
  declare sightingsInside: number;
}

Zone.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    zoneSetId: { type: DataTypes.UUID, allowNull: false },
    position: { type: DataTypes.INTEGER, allowNull: false },
    label: { type: DataTypes.TEXT, allowNull: false },
    geometry: { type: DataTypes.GEOMETRY('MULTIPOLYGON', 4326), allowNull: false },
    areaM2: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    shareOfField: { type: DataTypes.DOUBLE, allowNull: false },
    sightingsInside: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
  },
  { sequelize, tableName: 'zones' },
);
