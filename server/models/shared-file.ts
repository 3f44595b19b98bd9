import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';

export const SHARED_FILE_CATEGORIES = ['soil-test', 'map', 'season-report', 'proposal', 'invoice', 'photo', 'other', 'client-upload'] as const;
export type SharedFileCategory = (typeof SHARED_FILE_CATEGORIES)[number];

/** A document kept for a client (and optionally one property): shared by the consultant or uploaded by the client. */
export class SharedFile extends Model<InferAttributes<SharedFile>, InferCreationAttributes<SharedFile>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare clientId: number;
  declare propertyId: number | null;
  declare category: SharedFileCategory;
  declare title: string;
  declare storageKey: string;
  declare originalName: string | null;
  declare contentType: string;
  declare byteSize: number;
  /** Staff files can be kept private to the firm; client uploads are always visible to the client. */
  declare visibleToClient: CreationOptional<boolean>;
  declare uploadedById: number | null;
  declare uploadedByRole: CreationOptional<'staff' | 'client'>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

SharedFile.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    clientId: { type: DataTypes.INTEGER, allowNull: false },
    propertyId: DataTypes.INTEGER,
    category: { type: DataTypes.TEXT, allowNull: false },
    title: { type: DataTypes.TEXT, allowNull: false },
    storageKey: { type: DataTypes.TEXT, allowNull: false },
    originalName: DataTypes.TEXT,
    contentType: { type: DataTypes.TEXT, allowNull: false },
    byteSize: { type: DataTypes.INTEGER, allowNull: false },
    visibleToClient: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    uploadedById: DataTypes.INTEGER,
    uploadedByRole: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'staff' },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'shared_files', modelName: 'SharedFile' },
);
