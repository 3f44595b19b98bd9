import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';

type NumericKey = 'latitude' | 'longitude' | 'areaTreated' | 'amount' | 'windMph' | 'airTempF';

/** A NUMERIC column read back as a number (pg answers NUMERIC as text). */
const decimal = (key: NumericKey, precision: number, scale: number) => ({
  type: DataTypes.DECIMAL(precision, scale),
  get(this: SprayRecord) {
    const v = this.getDataValue(key) as unknown;
    return v === null || v === undefined ? null : Number(v);
  },
});

/** One product applied on a unit (7 CFR Part 110 fields plus weather); a copy that outlives edits. No updatedAt: records are not edited. */
export class SprayRecord extends Model<InferAttributes<SprayRecord>, InferCreationAttributes<SprayRecord>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare propertyId: number | null;
  declare unitId: number | null;
  declare taskId: number | null;
  declare appliedOn: string;
  declare propertyName: string;
  declare unitName: string;
  declare latitude: number | null;
  declare longitude: number | null;
  declare cropOrSite: string;
  declare areaTreated: number;
  declare areaUnit: CreationOptional<string>;
  declare materialKey: string;
  declare productName: string;
  declare epaRegNo: string | null;
  declare restrictedUse: boolean;
  declare amount: number;
  declare amountUnit: string;
  declare applicatorName: string;
  declare applicatorCertNo: string | null;
  declare windMph: number;
  declare windDirection: string;
  declare airTempF: number;
  declare recordedById: number | null;
  declare createdAt: CreationOptional<Date>;
}

SprayRecord.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    propertyId: DataTypes.INTEGER,
    unitId: DataTypes.INTEGER,
    taskId: DataTypes.INTEGER,
    appliedOn: { type: DataTypes.DATEONLY, allowNull: false },
    propertyName: { type: DataTypes.TEXT, allowNull: false },
    unitName: { type: DataTypes.TEXT, allowNull: false },
    latitude: decimal('latitude', 9, 6),
    longitude: decimal('longitude', 9, 6),
    cropOrSite: { type: DataTypes.TEXT, allowNull: false },
    areaTreated: { ...decimal('areaTreated', 10, 2), allowNull: false },
    areaUnit: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'acres' },
    materialKey: { type: DataTypes.TEXT, allowNull: false },
    productName: { type: DataTypes.TEXT, allowNull: false },
    epaRegNo: DataTypes.TEXT,
    restrictedUse: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    amount: { ...decimal('amount', 12, 3), allowNull: false },
    amountUnit: { type: DataTypes.TEXT, allowNull: false },
    applicatorName: { type: DataTypes.TEXT, allowNull: false },
    applicatorCertNo: DataTypes.TEXT,
    windMph: { ...decimal('windMph', 5, 1), allowNull: false },
    windDirection: { type: DataTypes.TEXT, allowNull: false },
    airTempF: { ...decimal('airTempF', 5, 1), allowNull: false },
    recordedById: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'spray_records', modelName: 'SprayRecord', underscored: true, updatedAt: false },
);
