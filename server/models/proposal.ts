import type { LineCategory } from '../../shared/schemas/proposal';
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import type { OrderDiscount, PlanSnapshot } from '../../shared/domain/proposal-totals';

export type ProposalStatus = 'draft' | 'sent' | 'approved' | 'declined' | 'withdrawn';

const numeric = (field: string) => ({
  type: DataTypes.DECIMAL(7, 4),
  allowNull: false,
  defaultValue: 0,
  get(this: Model) {
    return Number(this.getDataValue(field));
  },
});

/** A priced version of a property's plan, sent to the client for approval. */
export class Proposal extends Model<InferAttributes<Proposal>, InferCreationAttributes<Proposal>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare propertyId: number;
  declare clientId: number;
  /** The id of the first version; every revision shares it. */
  declare seriesId: number | null;
  declare number: string;
  declare version: CreationOptional<number>;
  declare status: CreationOptional<ProposalStatus>;
  declare title: string;
  declare introduction: string | null;
  declare terms: CreationOptional<string>;
  declare currency: CreationOptional<string>;
  declare discount: CreationOptional<OrderDiscount>;
  declare taxRatePct: CreationOptional<number>;
  declare depositPct: CreationOptional<number>;
  declare expiresOn: string | null;
  declare subtotalCents: CreationOptional<number>;
  declare discountCents: CreationOptional<number>;
  declare taxCents: CreationOptional<number>;
  declare totalCents: CreationOptional<number>;
  declare depositCents: CreationOptional<number>;
  declare sentAt: CreationOptional<Date | null>;
  declare firstViewedAt: CreationOptional<Date | null>;
  declare decidedAt: CreationOptional<Date | null>;
  declare declineReason: CreationOptional<string | null>;
  declare withdrawnAt: CreationOptional<Date | null>;
  /** The plan (boundary and units) as sent; null while a draft. */
  declare planSnapshot: CreationOptional<PlanSnapshot | null>;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Proposal.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    propertyId: { type: DataTypes.INTEGER, allowNull: false },
    clientId: { type: DataTypes.INTEGER, allowNull: false },
    seriesId: DataTypes.INTEGER,
    number: { type: DataTypes.TEXT, allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'draft' },
    title: { type: DataTypes.TEXT, allowNull: false },
    introduction: DataTypes.TEXT,
    terms: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    currency: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'USD' },
    discount: { type: DataTypes.JSONB, allowNull: false, defaultValue: { kind: 'none' } },
    taxRatePct: numeric('taxRatePct'),
    depositPct: numeric('depositPct'),
    expiresOn: DataTypes.DATEONLY,
    subtotalCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    discountCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    taxCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    totalCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    depositCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    sentAt: DataTypes.DATE,
    firstViewedAt: DataTypes.DATE,
    decidedAt: DataTypes.DATE,
    declineReason: DataTypes.TEXT,
    withdrawnAt: DataTypes.DATE,
    planSnapshot: DataTypes.JSONB,
    createdById: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'proposals', modelName: 'Proposal' },
);

/** One priced line of a proposal. */
export class ProposalLine extends Model<InferAttributes<ProposalLine>, InferCreationAttributes<ProposalLine>> {
  declare id: CreationOptional<number>;
  declare proposalId: number;
  declare position: number;
  declare unitId: number | null;
  declare prescriptionId: number | null;
  declare groupLabel: string;
  declare category: LineCategory;
  declare description: string;
  declare quantity: string;
  declare unit: string;
  declare unitPriceCents: number;
  declare taxable: boolean;
  declare optional: boolean;
  declare selected: boolean;
}

ProposalLine.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    proposalId: { type: DataTypes.INTEGER, allowNull: false },
    position: { type: DataTypes.INTEGER, allowNull: false },
    unitId: DataTypes.INTEGER,
    prescriptionId: DataTypes.INTEGER,
    groupLabel: { type: DataTypes.TEXT, allowNull: false },
    category: { type: DataTypes.TEXT, allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: false },
    quantity: { type: DataTypes.DECIMAL(14, 4), allowNull: false },
    unit: { type: DataTypes.TEXT, allowNull: false },
    unitPriceCents: { type: DataTypes.INTEGER, allowNull: false },
    taxable: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    optional: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    selected: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
  },
  { sequelize, tableName: 'proposal_lines', modelName: 'ProposalLine', timestamps: false },
);

/** The client's approval: who, when, from where, and the SHA-256 of exactly what they approved. */
export class ProposalApproval extends Model<InferAttributes<ProposalApproval>, InferCreationAttributes<ProposalApproval>> {
  declare id: CreationOptional<number>;
  declare proposalId: number;
  declare userId: number | null;
  declare signedName: string;
  declare signedAt: Date;
  declare ip: string | null;
  declare userAgent: string | null;
  declare contentHash: string;
  declare content: string;
  declare selectedOptionIds: number[];
  declare createdAt: CreationOptional<Date>;
}

ProposalApproval.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    proposalId: { type: DataTypes.INTEGER, allowNull: false },
    userId: DataTypes.INTEGER,
    signedName: { type: DataTypes.TEXT, allowNull: false },
    signedAt: { type: DataTypes.DATE, allowNull: false },
    ip: DataTypes.TEXT,
    userAgent: DataTypes.TEXT,
    contentHash: { type: DataTypes.TEXT, allowNull: false },
    content: { type: DataTypes.TEXT, allowNull: false },
    selectedOptionIds: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'proposal_approvals', modelName: 'ProposalApproval', updatedAt: false },
);
