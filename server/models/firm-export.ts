import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import type { FirmExportStatus } from '../../shared/schemas/firm-export';

/** One whole-firm zip: built in the background, kept in storage, downloaded by the owner. */
export class FirmExport extends Model<InferAttributes<FirmExport>, InferCreationAttributes<FirmExport>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare requestedById: number | null;
  declare jobId: string | null;
  declare status: CreationOptional<FirmExportStatus>;
  declare storageKey: string | null;
  declare byteSize: number | null;
  declare fileCount: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare finishedAt: Date | null;
}

FirmExport.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    requestedById: DataTypes.INTEGER,
    jobId: DataTypes.UUID,
    status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'building' },
    storageKey: DataTypes.TEXT,
    // BIGINT comes back from pg as a string; a zip is far below 2^53 bytes.
    byteSize: { type: DataTypes.BIGINT, get() { const v = this.getDataValue('byteSize'); return v === null ? null : Number(v); } },
    fileCount: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
    finishedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'firm_exports', underscored: true },
);
