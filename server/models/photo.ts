import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '../db.ts';
import type { ThumbnailStatus } from '../../shared/schemas/sightings.ts';

export const acceptedPhotoTypes = ['image/jpeg', 'image/png', 'image/webp', 'image/heic', 'image/heif'] as const;
export type PhotoMimeType = (typeof acceptedPhotoTypes)[number];

/** A stored photo. storageKey is made by the server; the uploaded name is kept only as a label. */
export class Photo extends Model<InferAttributes<Photo>, InferCreationAttributes<Photo>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare uploadedBy: string;
  declare sha256: string;
  declare storageKey: string;
  declare mimeType: PhotoMimeType;
  declare byteSize: number;
  declare originalName: CreationOptional<string>;
  declare exif: CreationOptional<Record<string, unknown>>;
  declare thumbnailKey: CreationOptional<string | null>;
  declare thumbnailStatus: CreationOptional<ThumbnailStatus>;
  declare thumbnailError: CreationOptional<string | null>;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
}

Photo.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organisationId: { type: DataTypes.UUID, allowNull: false },
    uploadedBy: { type: DataTypes.UUID, allowNull: false },
    sha256: { type: DataTypes.TEXT, allowNull: false },
    storageKey: { type: DataTypes.TEXT, allowNull: false },
    mimeType: { type: DataTypes.TEXT, allowNull: false },
    byteSize: { type: DataTypes.INTEGER, allowNull: false },
    originalName: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    exif: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    thumbnailKey: { type: DataTypes.TEXT, allowNull: true },
    thumbnailStatus: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'pending' },
    thumbnailError: { type: DataTypes.TEXT, allowNull: true },
    deletedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'photos' },
);
