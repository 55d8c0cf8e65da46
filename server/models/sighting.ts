import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import type { Point } from 'geojson';
import { sequelize } from '../db.ts';
import type { PositionSource, SightingStatus, TimeFlag } from '../../shared/schemas/sightings.ts';

/** One observation point: a photo's sighting, or an empty stop (count 0, no photo). */
export class Sighting extends Model<InferAttributes<Sighting>, InferCreationAttributes<Sighting>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare fieldId: string;
  declare walkId: string;
  declare pestId: string;
  declare photoId: CreationOptional<string | null>;
  declare photoSha256: CreationOptional<string | null>;
  declare count: CreationOptional<number | null>;
  declare position: CreationOptional<Point | null>;
  declare positionSource: PositionSource;
  declare accuracyM: CreationOptional<number | null>;
  declare altitudeM: CreationOptional<number | null>;
  declare directionDeg: CreationOptional<number | null>;
  declare observedAt: CreationOptional<Date | null>;
  declare timeFlag: CreationOptional<TimeFlag | null>;
  declare status: SightingStatus;
  declare createdBy: string;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
}

Sighting.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organisationId: { type: DataTypes.UUID, allowNull: false },
    fieldId: { type: DataTypes.UUID, allowNull: false },
    walkId: { type: DataTypes.UUID, allowNull: false },
    pestId: { type: DataTypes.UUID, allowNull: false },
    photoId: { type: DataTypes.UUID, allowNull: true },
    photoSha256: { type: DataTypes.TEXT, allowNull: true },
    count: { type: DataTypes.DOUBLE, allowNull: true },
    position: { type: DataTypes.GEOMETRY('POINT', 4326), allowNull: true },
    positionSource: { type: DataTypes.TEXT, allowNull: false },
    accuracyM: { type: DataTypes.DOUBLE, allowNull: true },
    altitudeM: { type: DataTypes.DOUBLE, allowNull: true },
    directionDeg: { type: DataTypes.DOUBLE, allowNull: true },
    observedAt: { type: DataTypes.DATE, allowNull: true },
    timeFlag: { type: DataTypes.TEXT, allowNull: true },
    status: { type: DataTypes.TEXT, allowNull: false },
    createdBy: { type: DataTypes.UUID, allowNull: false },
    deletedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'sightings' },
);
