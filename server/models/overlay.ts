import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';

export type Corners = [[number, number], [number, number], [number, number], [number, number]];

/** A georeferenced image (drone or purchased orthophoto) shown under a property's plan. */
export class Overlay extends Model<InferAttributes<Overlay>, InferCreationAttributes<Overlay>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare propertyId: number;
  declare name: string;
  declare storageKey: string;
  declare contentType: string;
  declare byteSize: number;
  /** [lon, lat] of the top-left, top-right, bottom-right and bottom-left corners. */
  declare corners: Corners;
  declare opacity: CreationOptional<number>;
  declare visible: CreationOptional<boolean>;
  declare inDocuments: CreationOptional<boolean>;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Overlay.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    propertyId: { type: DataTypes.INTEGER, allowNull: false },
    name: { type: DataTypes.TEXT, allowNull: false },
    storageKey: { type: DataTypes.TEXT, allowNull: false },
    contentType: { type: DataTypes.TEXT, allowNull: false },
    byteSize: { type: DataTypes.INTEGER, allowNull: false },
    corners: { type: DataTypes.JSONB, allowNull: false },
    opacity: {
      type: DataTypes.DECIMAL(3, 2),
      allowNull: false,
      defaultValue: 0.8,
      get() {
        return Number(this.getDataValue('opacity'));
      },
    },
    visible: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    inDocuments: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    createdById: DataTypes.INTEGER,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'overlays', modelName: 'Overlay' },
);
