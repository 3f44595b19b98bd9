import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import type { CheckKind, ReseedDraftDto } from '../../shared/schemas/checks';
import type { PlotCheckStatus } from '../../shared/domain/plot-checks';

/** One check on a unit: what was measured, the computed figures and, for a thin or failed stand, the drafted re-seeding. */
export class UnitCheck extends Model<InferAttributes<UnitCheck>, InferCreationAttributes<UnitCheck>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare propertyId: number;
  declare unitId: number;
  declare kind: CheckKind;
  declare checkedOn: string;
  declare season: number;
  declare input: Record<string, unknown>;
  declare result: Record<string, unknown>;
  declare status: PlotCheckStatus;
  declare reseed: ReseedDraftDto | null;
  declare notes: string | null;
  declare idempotencyKey: string | null;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

UnitCheck.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    propertyId: { type: DataTypes.INTEGER, allowNull: false },
    unitId: { type: DataTypes.INTEGER, allowNull: false },
    kind: { type: DataTypes.TEXT, allowNull: false },
    checkedOn: { type: DataTypes.DATEONLY, allowNull: false },
    season: { type: DataTypes.INTEGER, allowNull: false },
    input: { type: DataTypes.JSONB, allowNull: false },
    result: { type: DataTypes.JSONB, allowNull: false },
    status: { type: DataTypes.TEXT, allowNull: false },
    reseed: DataTypes.JSONB,
    notes: DataTypes.TEXT,
    idempotencyKey: DataTypes.TEXT,
    createdById: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'unit_checks', modelName: 'UnitCheck', underscored: true },
);
