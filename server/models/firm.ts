import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';

/** A consulting firm: the tenant every other record belongs to. */
export class Firm extends Model<InferAttributes<Firm>, InferCreationAttributes<Firm>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare slug: string;
  declare email: string | null;
  declare phone: string | null;
  declare address: string | null;
  declare website: CreationOptional<string | null>;
  declare licenceNumbers: CreationOptional<string | null>;
  declare logoKey: CreationOptional<string | null>;
  declare logoContentType: CreationOptional<string | null>;
  declare timezone: CreationOptional<string>;
  declare region: CreationOptional<string>;
  declare settings: CreationOptional<Record<string, unknown>>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Firm.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    name: { type: DataTypes.TEXT, allowNull: false },
    slug: { type: DataTypes.TEXT, allowNull: false, unique: true },
    email: DataTypes.TEXT,
    phone: DataTypes.TEXT,
    address: DataTypes.TEXT,
    website: DataTypes.TEXT,
    licenceNumbers: { type: DataTypes.TEXT, field: 'licence_numbers' },
    logoKey: { type: DataTypes.TEXT, field: 'logo_key' },
    logoContentType: { type: DataTypes.TEXT, field: 'logo_content_type' },
    timezone: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'America/Chicago' },
    region: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'midwest' },
    settings: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'firms', modelName: 'Firm' },
);
