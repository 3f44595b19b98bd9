import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import type { CameraTag } from '../../shared/domain/camera-events';
import type { AgeClass } from '../../shared/domain/survey-estimates';
import type { CameraMode } from '../../shared/schemas/cameras';

/** One trail camera of the firm's fleet. */
export class Camera extends Model<InferAttributes<Camera>, InferCreationAttributes<Camera>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare label: string;
  declare serial: string | null;
  declare retiredAt: Date | null;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Camera.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    label: { type: DataTypes.TEXT, allowNull: false },
    serial: DataTypes.TEXT,
    retiredAt: DataTypes.DATE,
    createdById: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'cameras', modelName: 'Camera' },
);

/** A camera set at one camera-site unit from `startedOn` until `endedOn` (null while it runs). */
export class CameraDeployment extends Model<InferAttributes<CameraDeployment>, InferCreationAttributes<CameraDeployment>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare cameraId: number;
  declare propertyId: number;
  declare unitId: number;
  declare startedOn: string;
  declare endedOn: string | null;
  declare mode: CameraMode;
  declare notes: string | null;
  /** Seconds to add to the camera's clock readings to get the true time. */
  declare clockOffsetSeconds: CreationOptional<number>;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

CameraDeployment.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    cameraId: { type: DataTypes.INTEGER, allowNull: false },
    propertyId: { type: DataTypes.INTEGER, allowNull: false },
    unitId: { type: DataTypes.INTEGER, allowNull: false },
    startedOn: { type: DataTypes.DATEONLY, allowNull: false },
    endedOn: DataTypes.DATEONLY,
    mode: { type: DataTypes.TEXT, allowNull: false },
    notes: DataTypes.TEXT,
    clockOffsetSeconds: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    createdById: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'camera_deployments', modelName: 'CameraDeployment' },
);

/** A visit that pulled a deployment's card. */
export class CardPull extends Model<InferAttributes<CardPull>, InferCreationAttributes<CardPull>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare deploymentId: number;
  declare pulledOn: string;
  declare batteryPct: number | null;
  declare photoCount: number | null;
  declare notes: string | null;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

CardPull.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    deploymentId: { type: DataTypes.INTEGER, allowNull: false },
    pulledOn: { type: DataTypes.DATEONLY, allowNull: false },
    batteryPct: DataTypes.INTEGER,
    photoCount: DataTypes.INTEGER,
    notes: DataTypes.TEXT,
    createdById: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'card_pulls', modelName: 'CardPull' },
);

/** One identified buck of a property's roster, kept across seasons. */
export class Buck extends Model<InferAttributes<Buck>, InferCreationAttributes<Buck>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare propertyId: number;
  declare name: string;
  declare notes: string | null;
  declare ageEstimates: CreationOptional<{ season: number; ageClass: AgeClass }[]>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Buck.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    propertyId: { type: DataTypes.INTEGER, allowNull: false },
    name: { type: DataTypes.TEXT, allowNull: false },
    notes: DataTypes.TEXT,
    ageEstimates: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'bucks', modelName: 'Buck' },
);

/** One photo from a deployment's card, with its review tag. */
export class CameraPhoto extends Model<InferAttributes<CameraPhoto>, InferCreationAttributes<CameraPhoto>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare deploymentId: number;
  declare propertyId: number;
  declare sha256: string;
  declare storageKey: string;
  declare thumbnailKey: string | null;
  declare contentType: string;
  declare byteSize: number;
  declare originalName: string | null;
  /** The camera's own clock reading "YYYY-MM-DDTHH:MM:SS" (EXIF DateTimeOriginal). */
  declare cameraTime: string | null;
  /** The UTC offset the camera wrote with its time (EXIF OffsetTimeOriginal), if any. */
  declare cameraOffset: string | null;
  /** The true time: the camera's reading in the firm's zone plus the deployment's clock offset. */
  declare takenAt: Date | null;
  declare tag: CameraTag | null;
  declare buckId: number | null;
  declare featured: CreationOptional<boolean>;
  declare flags: CreationOptional<string[]>;
  declare taggedById: number | null;
  declare taggedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

CameraPhoto.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    deploymentId: { type: DataTypes.INTEGER, allowNull: false },
    propertyId: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.TEXT, allowNull: false },
    storageKey: { type: DataTypes.TEXT, allowNull: false },
    thumbnailKey: DataTypes.TEXT,
    contentType: { type: DataTypes.TEXT, allowNull: false },
    byteSize: { type: DataTypes.INTEGER, allowNull: false },
    originalName: DataTypes.TEXT,
    cameraTime: DataTypes.TEXT,
    cameraOffset: DataTypes.TEXT,
    takenAt: DataTypes.DATE,
    tag: DataTypes.TEXT,
    buckId: DataTypes.INTEGER,
    featured: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    flags: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    taggedById: DataTypes.INTEGER,
    taggedAt: DataTypes.DATE,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'camera_photos', modelName: 'CameraPhoto' },
);
