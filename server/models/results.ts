import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import type { AgeClass } from '../../shared/domain/survey-estimates';
import type { HarvestSex, IdentifiedBuck } from '../../shared/schemas/results';

/** A trail-camera survey of one property: dates, the cameras used and the tallies of photos. */
export class CameraSurvey extends Model<InferAttributes<CameraSurvey>, InferCreationAttributes<CameraSurvey>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare propertyId: number;
  declare name: string;
  declare startDate: string;
  declare endDate: string;
  /** The hunting season (July–June) the survey started in, named by the year it starts. */
  declare season: number;
  declare buckPhotos: number;
  declare uniqueBucks: number;
  declare doePhotos: number;
  declare fawnPhotos: number;
  declare bucks: CreationOptional<IdentifiedBuck[]>;
  declare cameraUnitIds: CreationOptional<number[]>;
  declare cameraCount: number;
  declare notes: string | null;
  /** Acres the density refers to (a survey from photos: the area its cameras cover); null: the property. */
  declare areaAcres: CreationOptional<number | null>;
  /** The deployments and dates a survey was tallied from, when made from tagged photos. */
  declare fromPhotos: CreationOptional<{ deploymentIds: number[]; from: string; to: string } | null>;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

CameraSurvey.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    propertyId: { type: DataTypes.INTEGER, allowNull: false },
    name: { type: DataTypes.TEXT, allowNull: false },
    startDate: { type: DataTypes.DATEONLY, allowNull: false },
    endDate: { type: DataTypes.DATEONLY, allowNull: false },
    season: { type: DataTypes.INTEGER, allowNull: false },
    buckPhotos: { type: DataTypes.INTEGER, allowNull: false },
    uniqueBucks: { type: DataTypes.INTEGER, allowNull: false },
    doePhotos: { type: DataTypes.INTEGER, allowNull: false },
    fawnPhotos: { type: DataTypes.INTEGER, allowNull: false },
    bucks: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    cameraUnitIds: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    cameraCount: { type: DataTypes.INTEGER, allowNull: false },
    notes: DataTypes.TEXT,
    areaAcres: {
      type: DataTypes.DECIMAL(14, 4),
      get(this: Model) {
        const v = this.getDataValue('areaAcres') as unknown;
        return v === null || v === undefined ? null : Number(v);
      },
    },
    fromPhotos: DataTypes.JSONB,
    createdById: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'camera_surveys', modelName: 'CameraSurvey' },
);

/** One deer taken on a property. */
export class HarvestRecord extends Model<InferAttributes<HarvestRecord>, InferCreationAttributes<HarvestRecord>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare propertyId: number;
  declare date: string;
  declare season: number;
  declare sex: HarvestSex;
  declare ageClass: AgeClass;
  declare dressedWeightLb: number | null;
  declare antlerPoints: number | null;
  declare unitId: number | null;
  declare stand: string | null;
  declare hunter: string | null;
  declare notes: string | null;
  declare standUnitId: CreationOptional<number | null>;
  declare sitId: CreationOptional<number | null>;
  declare diseaseSampleNumber: CreationOptional<string | null>;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

HarvestRecord.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    propertyId: { type: DataTypes.INTEGER, allowNull: false },
    date: { type: DataTypes.DATEONLY, allowNull: false },
    season: { type: DataTypes.INTEGER, allowNull: false },
    sex: { type: DataTypes.TEXT, allowNull: false },
    ageClass: { type: DataTypes.TEXT, allowNull: false },
    dressedWeightLb: {
      type: DataTypes.DECIMAL(5, 1),
      get() {
        const v = this.getDataValue('dressedWeightLb') as unknown;
        return v === null || v === undefined ? null : Number(v);
      },
    },
    antlerPoints: DataTypes.INTEGER,
    unitId: DataTypes.INTEGER,
    stand: DataTypes.TEXT,
    hunter: DataTypes.TEXT,
    notes: DataTypes.TEXT,
    standUnitId: { type: DataTypes.INTEGER, field: 'stand_unit_id' },
    sitId: { type: DataTypes.INTEGER, field: 'sit_id' },
    diseaseSampleNumber: { type: DataTypes.TEXT, field: 'disease_sample_number' },
    createdById: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'harvest_records', modelName: 'HarvestRecord' },
);

/** A season report made for the landowner; the PDF is a shared file of category 'season-report'. */
export class SeasonReport extends Model<InferAttributes<SeasonReport>, InferCreationAttributes<SeasonReport>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare propertyId: number;
  declare clientId: number;
  declare season: number;
  declare recommendations: string | null;
  declare sharedFileId: number;
  declare sentAt: CreationOptional<Date | null>;
  declare sentTo: CreationOptional<string[]>;
  /** When a sent report was taken back out of the landowner's portal. */
  declare withdrawnAt: CreationOptional<Date | null>;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

SeasonReport.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    propertyId: { type: DataTypes.INTEGER, allowNull: false },
    clientId: { type: DataTypes.INTEGER, allowNull: false },
    season: { type: DataTypes.INTEGER, allowNull: false },
    recommendations: DataTypes.TEXT,
    sharedFileId: { type: DataTypes.INTEGER, allowNull: false },
    sentAt: DataTypes.DATE,
    sentTo: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    withdrawnAt: DataTypes.DATE,
    createdById: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'season_reports', modelName: 'SeasonReport' },
);
