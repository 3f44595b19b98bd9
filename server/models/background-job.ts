import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import type { JobKind, JobStatus } from '../../shared/schemas/job';

/** A job handed to the queue, as the firm sees it (its id is the queue's job id). */
export class BackgroundJob extends Model<InferAttributes<BackgroundJob>, InferCreationAttributes<BackgroundJob>> {
  declare id: string;
  declare firmId: number;
  declare kind: JobKind;
  declare status: CreationOptional<JobStatus>;
  declare progress: CreationOptional<number>;
  declare step: string | null;
  declare title: string;
  declare subjectType: string | null;
  declare subjectId: number | null;
  declare data: CreationOptional<Record<string, unknown>>;
  declare result: Record<string, unknown> | null;
  declare attempts: CreationOptional<number>;
  declare lastError: string | null;
  declare createdById: number | null;
  declare finishedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

BackgroundJob.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    kind: { type: DataTypes.TEXT, allowNull: false },
    status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'queued' },
    progress: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    step: DataTypes.TEXT,
    title: { type: DataTypes.TEXT, allowNull: false },
    subjectType: DataTypes.TEXT,
    subjectId: DataTypes.INTEGER,
    data: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    result: DataTypes.JSONB,
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    lastError: DataTypes.TEXT,
    createdById: DataTypes.INTEGER,
    finishedAt: DataTypes.DATE,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'background_jobs', underscored: true },
);
