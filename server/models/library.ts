import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type ModelStatic } from 'sequelize';
import { sequelize } from '../db/sequelize';
import type { MaterialDefinition, PracticeDefinition } from '../../shared/domain/practice';
import type { ServiceRate } from '../../shared/domain/service-rates';

/** A library entry: the firm's own copy of a domain definition, keyed within the firm. */
abstract class LibraryEntry<D> extends Model<InferAttributes<LibraryEntry<D>>, InferCreationAttributes<LibraryEntry<D>>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare key: string;
  declare name: string;
  declare definition: D;
  declare archived: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

const attributes = {
  id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
  firmId: { type: DataTypes.INTEGER, allowNull: false },
  key: { type: DataTypes.TEXT, allowNull: false },
  name: { type: DataTypes.TEXT, allowNull: false },
  definition: { type: DataTypes.JSONB, allowNull: false },
  archived: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
  createdAt: DataTypes.DATE,
  updatedAt: DataTypes.DATE,
};

/** Seed, lime, fertilizer, spray products and other supplies the firm buys. */
export class Material extends LibraryEntry<MaterialDefinition> {}
Material.init(attributes, { sequelize, tableName: 'materials', modelName: 'Material' });

/** Labor, equipment and fee rates. */
export class ServiceRateEntry extends LibraryEntry<ServiceRate> {}
ServiceRateEntry.init(attributes, { sequelize, tableName: 'service_rates', modelName: 'ServiceRate' });

/** Reusable practices with their steps, materials and rates. */
export class Practice extends LibraryEntry<PracticeDefinition> {}
Practice.init(attributes, { sequelize, tableName: 'practices', modelName: 'Practice' });

export type LibraryModel = ModelStatic<Material> | ModelStatic<ServiceRateEntry> | ModelStatic<Practice>;
