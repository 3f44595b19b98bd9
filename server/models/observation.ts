import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import type { Point } from 'geojson';
import { sequelize } from '../db/sequelize';
import type { ObservationKind, PositionSource } from '../../shared/domain/observations';

/** Sign seen on the ground (a rub, a scrape, standing water…), placed in a unit of the plan. */
export class Observation extends Model<InferAttributes<Observation>, InferCreationAttributes<Observation>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare propertyId: number;
  declare unitId: number | null;
  declare kind: ObservationKind;
  declare observedAt: Date;
  declare notes: string | null;
  declare position: Point;
  declare positionSource: PositionSource;
  declare insideBoundary: boolean;
  /** The phone's idempotency key: the same key answers the first observation again. */
  declare idempotencyKey: string;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Observation.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    propertyId: { type: DataTypes.INTEGER, allowNull: false },
    unitId: DataTypes.INTEGER,
    kind: { type: DataTypes.TEXT, allowNull: false },
    observedAt: { type: DataTypes.DATE, allowNull: false },
    notes: DataTypes.TEXT,
    position: { type: DataTypes.GEOMETRY('POINT', 4326), allowNull: false },
    positionSource: { type: DataTypes.TEXT, allowNull: false },
    insideBoundary: { type: DataTypes.BOOLEAN, allowNull: false },
    idempotencyKey: { type: DataTypes.TEXT, allowNull: false },
    createdById: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'observations', modelName: 'Observation' },
);

/** A photo of an observation; the bytes and thumbnail live in storage under random keys. */
export class ObservationPhoto extends Model<InferAttributes<ObservationPhoto>, InferCreationAttributes<ObservationPhoto>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare observationId: number;
  declare storageKey: string;
  declare thumbnailKey: string | null;
  declare originalName: string | null;
  declare contentType: string;
  declare byteSize: number;
  declare width: number | null;
  declare height: number | null;
  declare sha256: string;
  declare takenAt: Date | null;
  declare latitude: number | null;
  declare longitude: number | null;
  declare exifProblems: CreationOptional<string[]>;
  declare createdAt: CreationOptional<Date>;
}

ObservationPhoto.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    observationId: { type: DataTypes.INTEGER, allowNull: false },
    storageKey: { type: DataTypes.TEXT, allowNull: false },
    thumbnailKey: DataTypes.TEXT,
    originalName: DataTypes.TEXT,
    contentType: { type: DataTypes.TEXT, allowNull: false },
    byteSize: { type: DataTypes.INTEGER, allowNull: false },
    width: DataTypes.INTEGER,
    height: DataTypes.INTEGER,
    sha256: { type: DataTypes.TEXT, allowNull: false },
    takenAt: DataTypes.DATE,
    latitude: DataTypes.DOUBLE,
    longitude: DataTypes.DOUBLE,
    exifProblems: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'observation_photos', modelName: 'ObservationPhoto', updatedAt: false },
);
