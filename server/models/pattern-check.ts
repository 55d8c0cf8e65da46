import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '../db.ts';
import type { CheckStatus } from '../../shared/schemas/checks.ts';

/** One pattern check: field × pest × date window, with the exact inputs that reproduce it. */
export class PatternCheck extends Model<InferAttributes<PatternCheck>, InferCreationAttributes<PatternCheck>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare fieldId: string;
  declare pestId: string;
  /** YYYY-MM-DD, or null for an open window. */
  declare windowFrom: string | null;
  declare windowTo: string | null;
  declare options: Record<string, unknown>;
  declare optionsHash: string;
  declare sightingIds: string[];
  declare sightingsHash: string;
  declare engineVersion: string;
  declare status: CreationOptional<CheckStatus>;
  declare progress: CreationOptional<number>;
  declare result: CreationOptional<Record<string, unknown> | null>;
  declare error: CreationOptional<string | null>;
  declare createdBy: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare finishedAt: CreationOptional<Date | null>;
  /** From the finished result: the design, the same-stop merges and the not-scouted part of the field. */
  declare design: CreationOptional<'stops' | 'whole-field' | null>;
  declare stopMerges: CreationOptional<unknown[] | null>;
  declare notScouted: CreationOptional<{ type: 'MultiPolygon'; coordinates: number[][][][] } | null>;
  declare notScoutedM2: CreationOptional<number | null>;
}

PatternCheck.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organisationId: { type: DataTypes.UUID, allowNull: false },
    fieldId: { type: DataTypes.UUID, allowNull: false },
    pestId: { type: DataTypes.UUID, allowNull: false },
    windowFrom: { type: DataTypes.DATEONLY, allowNull: true },
    windowTo: { type: DataTypes.DATEONLY, allowNull: true },
    options: { type: DataTypes.JSONB, allowNull: false },
    optionsHash: { type: DataTypes.TEXT, allowNull: false },
    sightingIds: { type: DataTypes.ARRAY(DataTypes.UUID), allowNull: false },
    sightingsHash: { type: DataTypes.TEXT, allowNull: false },
    engineVersion: { type: DataTypes.TEXT, allowNull: false },
    status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'queued' },
    progress: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    result: { type: DataTypes.JSONB, allowNull: true },
    error: { type: DataTypes.TEXT, allowNull: true },
    createdBy: { type: DataTypes.UUID, allowNull: false },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
    finishedAt: { type: DataTypes.DATE, allowNull: true },
    design: { type: DataTypes.TEXT, allowNull: true },
    stopMerges: { type: DataTypes.JSONB, allowNull: true },
    notScouted: { type: DataTypes.GEOMETRY('MULTIPOLYGON', 4326), allowNull: true },
    notScoutedM2: { type: DataTypes.DOUBLE, allowNull: true },
  },
  { sequelize, tableName: 'pattern_checks' },
);
