import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';

const decimal = (field: string, precision: number, scale: number) => ({
  type: DataTypes.DECIMAL(precision, scale),
  get(this: Model) {
    const v = this.getDataValue(field) as unknown;
    return v === null || v === undefined ? null : Number(v);
  },
});

/** What a stand-site unit watches: its type, height and the side deer approach the watched unit from. */
export class StandSite extends Model<InferAttributes<StandSite>, InferCreationAttributes<StandSite>> {
  declare unitId: number;
  declare firmId: number;
  declare watchedUnitId: number | null;
  declare standType: string | null;
  declare heightFt: number | null;
  declare approachFrom: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

StandSite.init(
  {
    unitId: { type: DataTypes.INTEGER, primaryKey: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    watchedUnitId: DataTypes.INTEGER,
    standType: DataTypes.TEXT,
    heightFt: decimal('heightFt', 6, 1),
    approachFrom: DataTypes.TEXT,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'stand_sites', modelName: 'StandSite' },
);

/** A property's wind record: the 16-wind rose of the hours that matter, and how it was made. */
export class WindRecord extends Model<InferAttributes<WindRecord>, InferCreationAttributes<WindRecord>> {
  declare propertyId: number;
  declare firmId: number;
  declare source: string;
  declare fileName: string | null;
  declare months: number[];
  declare hoursFilter: string;
  declare rose: { from: string; share: number }[];
  declare hours: number;
  declare calmHours: number;
  declare skippedRows: number;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

WindRecord.init(
  {
    propertyId: { type: DataTypes.INTEGER, primaryKey: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    source: { type: DataTypes.TEXT, allowNull: false },
    fileName: DataTypes.TEXT,
    months: { type: DataTypes.ARRAY(DataTypes.INTEGER), allowNull: false },
    hoursFilter: { type: DataTypes.TEXT, allowNull: false },
    rose: { type: DataTypes.JSONB, allowNull: false },
    hours: { type: DataTypes.INTEGER, allowNull: false },
    calmHours: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    skippedRows: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    createdById: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'wind_records', modelName: 'WindRecord' },
);

/** One sit in a stand: when, the wind, the deer seen. Keyed by the phone's idempotency key. */
export class Sit extends Model<InferAttributes<Sit>, InferCreationAttributes<Sit>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare propertyId: number;
  declare standUnitId: number;
  declare startedAt: Date;
  declare endedAt: Date;
  declare windFrom: string | null;
  declare windMph: number | null;
  declare bucks: number;
  declare does: number;
  declare fawns: number;
  declare notes: string | null;
  /** Identified bucks of the property's camera roster seen on the sit. */
  declare buckIds: CreationOptional<number[]>;
  declare loggedById: number | null;
  declare idempotencyKey: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Sit.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    propertyId: { type: DataTypes.INTEGER, allowNull: false },
    standUnitId: { type: DataTypes.INTEGER, allowNull: false },
    startedAt: { type: DataTypes.DATE, allowNull: false },
    endedAt: { type: DataTypes.DATE, allowNull: false },
    windFrom: DataTypes.TEXT,
    windMph: decimal('windMph', 5, 1),
    bucks: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    does: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    fawns: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    notes: DataTypes.TEXT,
    buckIds: { type: DataTypes.ARRAY(DataTypes.INTEGER), allowNull: false, defaultValue: [], field: 'buck_ids' },
    loggedById: DataTypes.INTEGER,
    idempotencyKey: { type: DataTypes.TEXT, allowNull: false },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'sits', modelName: 'Sit' },
);
