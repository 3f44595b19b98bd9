import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import type { MultiPolygon } from 'geojson';
import { sequelize } from '../db/sequelize';

/** A client's tract of land with its boundary (MultiPolygon, SRID 4326) and computed acres. */
export class Property extends Model<InferAttributes<Property>, InferCreationAttributes<Property>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare clientId: number;
  declare name: string;
  declare county: string | null;
  declare state: string | null;
  declare region: string | null;
  declare objectives: string | null;
  declare notes: string | null;
  declare boundary: MultiPolygon | null;
  declare acres: number | null;
  declare perimeterFt: number | null;
  declare revision: CreationOptional<number>;
  /** E-mail the client when all of a unit's tasks are finished. */
  declare notifyClientOnUnitDone: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Property.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    clientId: { type: DataTypes.INTEGER, allowNull: false },
    name: { type: DataTypes.TEXT, allowNull: false },
    county: DataTypes.TEXT,
    state: DataTypes.TEXT,
    region: DataTypes.TEXT,
    objectives: DataTypes.TEXT,
    notes: DataTypes.TEXT,
    boundary: DataTypes.GEOMETRY('MULTIPOLYGON', 4326),
    acres: {
      type: DataTypes.DECIMAL(12, 3),
      get() {
        const v = this.getDataValue('acres') as unknown;
        return v === null || v === undefined ? null : Number(v);
      },
    },
    perimeterFt: {
      type: DataTypes.DECIMAL(14, 1),
      get() {
        const v = this.getDataValue('perimeterFt') as unknown;
        return v === null || v === undefined ? null : Number(v);
      },
    },
    revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    notifyClientOnUnitDone: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'properties', modelName: 'Property' },
);
