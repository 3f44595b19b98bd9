import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import type { LimeRecommendationResult, NutrientRecommendation } from '../../shared/domain/soil-tests';

type NumericKey = 'ph' | 'bufferPh' | 'pPpm' | 'kPpm' | 'organicMatterPct' | 'cec' | 'enmLbPerAcre';

/** A NUMERIC column read back as a number (pg answers NUMERIC as text). */
const decimal = (key: NumericKey, precision: number, scale: number) => ({
  type: DataTypes.DECIMAL(precision, scale),
  get(this: SoilTest) {
    const v = this.getDataValue(key) as unknown;
    return v === null || v === undefined ? null : Number(v);
  },
});

/** A lab's soil test of a unit with the lime and fertilizer recommendation worked when it was stored. */
export class SoilTest extends Model<InferAttributes<SoilTest>, InferCreationAttributes<SoilTest>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare propertyId: number;
  declare unitId: number;
  declare sampledOn: string;
  declare lab: string;
  declare ph: number;
  declare bufferPh: number | null;
  declare bufferMethod: string | null;
  declare labMethod: CreationOptional<string>;
  declare pPpm: number | null;
  declare kPpm: number | null;
  declare organicMatterPct: number | null;
  declare cec: number | null;
  declare enmLbPerAcre: number | null;
  declare cropGroup: string;
  declare recommendation: { lime: LimeRecommendationResult; nutrients: NutrientRecommendation };
  declare retestDue: string;
  declare appliedPrescriptionId: number | null;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

SoilTest.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    propertyId: { type: DataTypes.INTEGER, allowNull: false },
    unitId: { type: DataTypes.INTEGER, allowNull: false },
    sampledOn: { type: DataTypes.DATEONLY, allowNull: false },
    lab: { type: DataTypes.TEXT, allowNull: false },
    ph: { ...decimal('ph', 4, 2), allowNull: false },
    bufferPh: decimal('bufferPh', 4, 2),
    bufferMethod: DataTypes.TEXT,
    labMethod: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'bray-nh4oac' },
    pPpm: decimal('pPpm', 8, 2),
    kPpm: decimal('kPpm', 8, 2),
    organicMatterPct: decimal('organicMatterPct', 5, 2),
    cec: decimal('cec', 6, 2),
    enmLbPerAcre: decimal('enmLbPerAcre', 8, 1),
    cropGroup: { type: DataTypes.TEXT, allowNull: false },
    recommendation: { type: DataTypes.JSONB, allowNull: false },
    retestDue: { type: DataTypes.DATEONLY, allowNull: false },
    appliedPrescriptionId: DataTypes.INTEGER,
    createdById: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'soil_tests', modelName: 'SoilTest' },
);
