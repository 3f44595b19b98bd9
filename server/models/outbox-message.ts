import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';

export interface OutboxAttachment {
  filename: string;
  contentType: string;
  /** base64 of the bytes */
  contentBase64: string;
}

/** An e-mail waiting to be delivered; written in the same transaction as the action behind it. */
export class OutboxMessage extends Model<InferAttributes<OutboxMessage>, InferCreationAttributes<OutboxMessage>> {
  declare id: CreationOptional<number>;
  declare firmId: number | null;
  declare kind: string;
  declare toAddress: string;
  declare subject: string;
  declare textBody: string;
  declare htmlBody: string | null;
  declare attachments: CreationOptional<OutboxAttachment[]>;
  declare status: CreationOptional<'pending' | 'sent' | 'failed'>;
  declare attempts: CreationOptional<number>;
  declare nextAttemptAt: CreationOptional<Date>;
  /** Until when delivery is retried (3 days from queueing or from the owner's resend). */
  declare retryUntil: CreationOptional<Date>;
  declare lastError: string | null;
  declare sentAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

OutboxMessage.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: DataTypes.INTEGER,
    kind: { type: DataTypes.TEXT, allowNull: false },
    toAddress: { type: DataTypes.TEXT, allowNull: false },
    subject: { type: DataTypes.TEXT, allowNull: false },
    textBody: { type: DataTypes.TEXT, allowNull: false },
    htmlBody: DataTypes.TEXT,
    attachments: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'pending' },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    nextAttemptAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    retryUntil: { type: DataTypes.DATE, allowNull: false, defaultValue: () => new Date(Date.now() + 3 * 24 * 3_600_000) },
    lastError: DataTypes.TEXT,
    sentAt: DataTypes.DATE,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'outbox_messages', modelName: 'OutboxMessage' },
);
