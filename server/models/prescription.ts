import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import type { PrescriptionParameters } from '../../shared/domain/practice';
import type { PrescriptionResult } from '../../shared/domain/prescription-quantities';
import type { ScheduleResult } from '../../shared/domain/planting-windows';
import type { Caution } from '../../shared/domain/cautions';

/** The treatment written for a unit from a practice, with its computed quantities, schedule and cost. */
export class Prescription extends Model<InferAttributes<Prescription>, InferCreationAttributes<Prescription>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare propertyId: number;
  declare unitId: number;
  declare practiceId: number;
  declare year: number;
  declare targetDate: string | null;
  declare count: number | null;
  declare notes: string | null;
  declare parameters: PrescriptionParameters;
  declare result: PrescriptionResult;
  declare schedule: ScheduleResult;
  declare cautions: Caution[];
  declare summary: string;
  declare totalCents: number;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Prescription.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    propertyId: { type: DataTypes.INTEGER, allowNull: false },
    unitId: { type: DataTypes.INTEGER, allowNull: false },
    practiceId: { type: DataTypes.INTEGER, allowNull: false },
    year: { type: DataTypes.INTEGER, allowNull: false },
    targetDate: DataTypes.DATEONLY,
    count: DataTypes.INTEGER,
    notes: DataTypes.TEXT,
    parameters: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    result: { type: DataTypes.JSONB, allowNull: false },
    schedule: { type: DataTypes.JSONB, allowNull: false },
    cautions: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    summary: { type: DataTypes.TEXT, allowNull: false },
    totalCents: { type: DataTypes.INTEGER, allowNull: false },
    createdById: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'prescriptions', modelName: 'Prescription' },
);
