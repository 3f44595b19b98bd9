import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';

/** Who did what, when, to which record. */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare firmId: number | null;
  declare userId: number | null;
  declare action: string;
  declare subjectType: string | null;
  declare subjectId: number | null;
  declare data: CreationOptional<Record<string, unknown>>;
  declare ip: string | null;
  declare createdAt: CreationOptional<Date>;
}

AuditEvent.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: DataTypes.INTEGER,
    userId: DataTypes.INTEGER,
    action: { type: DataTypes.TEXT, allowNull: false },
    subjectType: DataTypes.TEXT,
    subjectId: DataTypes.INTEGER,
    data: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    ip: DataTypes.TEXT,
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'audit_events', modelName: 'AuditEvent', updatedAt: false },
);
