import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import type { Geometry } from 'geojson';
import { sequelize } from '../db/sequelize';
import type { UnitKind } from '../../shared/domain/unit-kinds';

const num = (field: string) => ({
  type: DataTypes.DECIMAL(14, 4),
  get(this: Model) {
    const v = this.getDataValue(field) as unknown;
    return v === null || v === undefined ? null : Number(v);
  },
});

/** One mapped feature of a property's plan, with its measures computed on the server. */
export class Unit extends Model<InferAttributes<Unit>, InferCreationAttributes<Unit>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare propertyId: number;
  declare kind: UnitKind;
  declare name: string;
  declare notes: string | null;
  declare geometry: Geometry;
  declare acres: number | null;
  declare perimeterFt: number | null;
  declare lengthFt: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Unit.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    propertyId: { type: DataTypes.INTEGER, allowNull: false },
    kind: { type: DataTypes.TEXT, allowNull: false },
    name: { type: DataTypes.TEXT, allowNull: false },
    notes: DataTypes.TEXT,
    geometry: { type: DataTypes.GEOMETRY, allowNull: false },
    acres: num('acres'),
    perimeterFt: num('perimeterFt'),
    lengthFt: num('lengthFt'),
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'units', modelName: 'Unit' },
);
