import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import type { SeasonPlan } from '../../shared/domain/next-season';

/** Next season's plan of a property with the changes the consultant accepts or rejects. */
export class SeasonDraft extends Model<InferAttributes<SeasonDraft>, InferCreationAttributes<SeasonDraft>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare propertyId: number;
  declare season: number;
  declare plan: SeasonPlan;
  declare status: CreationOptional<'draft' | 'written'>;
  declare prescriptionIds: CreationOptional<number[]>;
  declare proposalId: number | null;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

SeasonDraft.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    propertyId: { type: DataTypes.INTEGER, allowNull: false },
    season: { type: DataTypes.INTEGER, allowNull: false },
    plan: { type: DataTypes.JSONB, allowNull: false },
    status: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'draft' },
    prescriptionIds: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    proposalId: DataTypes.INTEGER,
    createdById: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'season_drafts', modelName: 'SeasonDraft' },
);
