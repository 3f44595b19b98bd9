import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import type { Caution } from '../../shared/domain/cautions';
import type { TaskQuantity, TaskQuantityUsed, TaskStatus } from '../../shared/domain/tasks';

const decimal = (field: string, precision: number, scale: number) => ({
  type: DataTypes.DECIMAL(precision, scale),
  get(this: Model) {
    const value = this.getDataValue(field) as string | null;
    return value === null || value === undefined ? null : Number(value);
  },
});

/** One step of an approved prescription, to be done on a unit inside its window by a crew member. */
export class Task extends Model<InferAttributes<Task>, InferCreationAttributes<Task>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare propertyId: number;
  declare unitId: number | null;
  declare prescriptionId: number | null;
  declare proposalId: number | null;
  declare stepKey: string;
  declare name: string;
  declare kind: string;
  declare practiceName: string;
  declare unitName: string;
  /** Step keys of the same prescription that must be done first. */
  declare dependsOn: CreationOptional<string[]>;
  declare earliest: string;
  declare latest: string;
  declare startDate: string | null;
  declare endDate: string | null;
  declare status: CreationOptional<TaskStatus>;
  declare assigneeId: number | null;
  declare quantities: CreationOptional<TaskQuantity[]>;
  declare cautions: CreationOptional<Caution[]>;
  /** The step's share of the prescription's cost: the weight of this task in progress by cost. */
  declare costCents: CreationOptional<number>;
  declare position: CreationOptional<number>;
  declare doneOn: CreationOptional<string | null>;
  declare completedAt: CreationOptional<Date | null>;
  declare completedById: CreationOptional<number | null>;
  declare notes: CreationOptional<string | null>;
  declare hours: CreationOptional<number | null>;
  declare quantitiesUsed: CreationOptional<TaskQuantityUsed[]>;
  declare skipReason: CreationOptional<string | null>;
  /** The client-made idempotency key of the completion that closed the task. */
  declare completionKey: CreationOptional<string | null>;
  /** The invoice that billed this task (progress invoices). */
  declare invoiceId: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Task.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    propertyId: { type: DataTypes.INTEGER, allowNull: false },
    unitId: DataTypes.INTEGER,
    prescriptionId: DataTypes.INTEGER,
    proposalId: DataTypes.INTEGER,
    stepKey: { type: DataTypes.TEXT, allowNull: false },
    name: { type: DataTypes.TEXT, allowNull: false },
    kind: { type: DataTypes.TEXT, allowNull: false },
    practiceName: { type: DataTypes.TEXT, allowNull: false },
    unitName: { type: DataTypes.TEXT, allowNull: false },
    dependsOn: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    earliest: { type: DataTypes.DATEONLY, allowNull: false },
    latest: { type: DataTypes.DATEONLY, allowNull: false },
    startDate: DataTypes.DATEONLY,
    endDate: DataTypes.DATEONLY,
    status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'planned' },
    assigneeId: DataTypes.INTEGER,
    quantities: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    cautions: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    costCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    doneOn: DataTypes.DATEONLY,
    completedAt: DataTypes.DATE,
    completedById: DataTypes.INTEGER,
    notes: DataTypes.TEXT,
    hours: decimal('hours', 7, 2),
    quantitiesUsed: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    skipReason: DataTypes.TEXT,
    completionKey: DataTypes.TEXT,
    invoiceId: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'tasks', modelName: 'Task' },
);

/** A photo the crew took when finishing a task; the bytes live on disk under a random key. */
export class TaskPhoto extends Model<InferAttributes<TaskPhoto>, InferCreationAttributes<TaskPhoto>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare taskId: number;
  declare storageKey: string;
  declare originalName: string | null;
  declare contentType: string;
  declare byteSize: number;
  declare latitude: number | null;
  declare longitude: number | null;
  declare takenAt: Date | null;
  declare uploadedById: number | null;
  declare createdAt: CreationOptional<Date>;
}

TaskPhoto.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    taskId: { type: DataTypes.INTEGER, allowNull: false },
    storageKey: { type: DataTypes.TEXT, allowNull: false },
    originalName: DataTypes.TEXT,
    contentType: { type: DataTypes.TEXT, allowNull: false },
    byteSize: { type: DataTypes.INTEGER, allowNull: false },
    latitude: DataTypes.DOUBLE,
    longitude: DataTypes.DOUBLE,
    takenAt: DataTypes.DATE,
    uploadedById: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'task_photos', modelName: 'TaskPhoto', updatedAt: false },
);

/** A crew member's private iCalendar feed; the URL carries a token whose SHA-256 is kept here. */
export class CalendarFeed extends Model<InferAttributes<CalendarFeed>, InferCreationAttributes<CalendarFeed>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare userId: number;
  declare tokenHash: string;
  declare revokedAt: CreationOptional<Date | null>;
  declare lastUsedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
}

CalendarFeed.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    userId: { type: DataTypes.INTEGER, allowNull: false },
    tokenHash: { type: DataTypes.TEXT, allowNull: false },
    revokedAt: DataTypes.DATE,
    lastUsedAt: DataTypes.DATE,
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'calendar_feeds', modelName: 'CalendarFeed', updatedAt: false },
);
