import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import type { InvoiceKind, InvoiceLineSource, InvoiceStatus } from '../../shared/domain/invoicing';
import type { InvoiceDocumentInput } from '../../templates/documents/invoice';
import type { DocumentFirm } from '../../shared/schemas/firm';

/** The issued part of an invoice's PDF, kept when it is sent; status and payments stay live. */
export type InvoiceDocumentSnapshot = Pick<InvoiceDocumentInput, 'client' | 'property' | 'invoice' | 'lines'> & {
  /** The firm's profile as it was when sent (the logo by its storage key; logo files are never overwritten). */
  firm: DocumentFirm;
  totals: Pick<InvoiceDocumentInput['totals'], 'subtotalCents' | 'taxCents' | 'totalCents'>;
};

/** A bill to a client: deposit, progress or final, from an approved proposal, plus manual lines. */
export class Invoice extends Model<InferAttributes<Invoice>, InferCreationAttributes<Invoice>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare clientId: number;
  declare propertyId: number | null;
  declare proposalId: number | null;
  declare kind: InvoiceKind;
  declare number: string;
  declare status: CreationOptional<InvoiceStatus>;
  declare currency: CreationOptional<string>;
  declare taxRatePct: CreationOptional<number>;
  declare termsDays: CreationOptional<number>;
  declare notes: CreationOptional<string | null>;
  declare issuedOn: CreationOptional<string | null>;
  declare dueOn: CreationOptional<string | null>;
  declare subtotalCents: CreationOptional<number>;
  declare taxCents: CreationOptional<number>;
  declare totalCents: CreationOptional<number>;
  /** The part of the total billed from the proposal (deposit, progress net, final). */
  declare billedCents: CreationOptional<number>;
  declare amountPaidCents: CreationOptional<number>;
  declare amountRefundedCents: CreationOptional<number>;
  declare sentAt: CreationOptional<Date | null>;
  declare paidAt: CreationOptional<Date | null>;
  declare voidedAt: CreationOptional<Date | null>;
  declare voidReason: CreationOptional<string | null>;
  declare lastReminderOn: CreationOptional<string | null>;
  declare reminderCount: CreationOptional<number>;
  /** What the PDF showed when the invoice was issued (payments are added live); null while a draft. */
  declare documentSnapshot: CreationOptional<InvoiceDocumentSnapshot | null>;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Invoice.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    clientId: { type: DataTypes.INTEGER, allowNull: false },
    propertyId: DataTypes.INTEGER,
    proposalId: DataTypes.INTEGER,
    kind: { type: DataTypes.TEXT, allowNull: false },
    number: { type: DataTypes.TEXT, allowNull: false },
    status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'draft' },
    currency: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'USD' },
    taxRatePct: {
      type: DataTypes.DECIMAL(7, 4),
      allowNull: false,
      defaultValue: 0,
      get(this: Model) {
        return Number(this.getDataValue('taxRatePct'));
      },
    },
    termsDays: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 30 },
    notes: DataTypes.TEXT,
    issuedOn: DataTypes.DATEONLY,
    dueOn: DataTypes.DATEONLY,
    subtotalCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    taxCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    totalCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    billedCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    amountPaidCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    amountRefundedCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    sentAt: DataTypes.DATE,
    paidAt: DataTypes.DATE,
    voidedAt: DataTypes.DATE,
    voidReason: DataTypes.TEXT,
    lastReminderOn: DataTypes.DATEONLY,
    reminderCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    documentSnapshot: DataTypes.JSONB,
    createdById: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'invoices', modelName: 'Invoice' },
);

/** One line of an invoice. */
export class InvoiceLine extends Model<InferAttributes<InvoiceLine>, InferCreationAttributes<InvoiceLine>> {
  declare id: CreationOptional<number>;
  declare invoiceId: number;
  declare position: number;
  declare source: InvoiceLineSource;
  declare taskId: number | null;
  declare description: string;
  declare quantity: string;
  declare unit: CreationOptional<string>;
  declare unitPriceCents: number;
  declare amountCents: number;
  declare taxable: CreationOptional<boolean>;
}

InvoiceLine.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    invoiceId: { type: DataTypes.INTEGER, allowNull: false },
    position: { type: DataTypes.INTEGER, allowNull: false },
    source: { type: DataTypes.TEXT, allowNull: false },
    taskId: DataTypes.INTEGER,
    description: { type: DataTypes.TEXT, allowNull: false },
    quantity: { type: DataTypes.DECIMAL(14, 4), allowNull: false },
    unit: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'each' },
    unitPriceCents: { type: DataTypes.INTEGER, allowNull: false },
    amountCents: { type: DataTypes.INTEGER, allowNull: false },
    taxable: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
  },
  { sequelize, tableName: 'invoice_lines', modelName: 'InvoiceLine', timestamps: false },
);

/** Money the payments service reports received for an invoice (one row per payment intent). */
export class InvoicePayment extends Model<InferAttributes<InvoicePayment>, InferCreationAttributes<InvoicePayment>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare invoiceId: number;
  declare amountCents: number;
  declare refundedCents: CreationOptional<number>;
  declare currency: CreationOptional<string>;
  declare processorPaymentId: string;
  declare processorSessionId: string | null;
  declare receivedAt: Date;
  declare createdAt: CreationOptional<Date>;
}

InvoicePayment.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    invoiceId: { type: DataTypes.INTEGER, allowNull: false },
    amountCents: { type: DataTypes.INTEGER, allowNull: false },
    refundedCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    currency: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'USD' },
    processorPaymentId: { type: DataTypes.TEXT, allowNull: false },
    processorSessionId: DataTypes.TEXT,
    receivedAt: { type: DataTypes.DATE, allowNull: false },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'invoice_payments', modelName: 'InvoicePayment', updatedAt: false },
);

/** Money given back on a payment, by the owner. */
export class InvoiceRefund extends Model<InferAttributes<InvoiceRefund>, InferCreationAttributes<InvoiceRefund>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare invoiceId: number;
  declare paymentId: number;
  declare amountCents: number;
  declare reason: string | null;
  declare processorRefundId: string;
  /** The key of the owner's refund request that made it (null for refunds made elsewhere). */
  declare requestKey: CreationOptional<string | null>;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;
}

InvoiceRefund.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    invoiceId: { type: DataTypes.INTEGER, allowNull: false },
    paymentId: { type: DataTypes.INTEGER, allowNull: false },
    amountCents: { type: DataTypes.INTEGER, allowNull: false },
    reason: DataTypes.TEXT,
    processorRefundId: { type: DataTypes.TEXT, allowNull: false },
    requestKey: DataTypes.TEXT,
    createdById: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'invoice_refunds', modelName: 'InvoiceRefund', updatedAt: false },
);
