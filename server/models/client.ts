import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';

/** A landowner, family or hunting club the firm works for. */
export class Client extends Model<InferAttributes<Client>, InferCreationAttributes<Client>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare name: string;
  declare email: string | null;
  declare phone: string | null;
  declare address: string | null;
  declare notes: string | null;
  /** Whether the client's contacts may upload their own files in the portal. */
  declare portalUploadsAllowed: CreationOptional<boolean>;
  /** Whether the client's contacts may log field observations on their own land in the portal. */
  declare portalObservationsAllowed: CreationOptional<boolean>;
  /** The client's contacts may log sits and harvests in the portal. */
  declare portalSitsAllowed: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Client.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    name: { type: DataTypes.TEXT, allowNull: false },
    email: DataTypes.TEXT,
    phone: DataTypes.TEXT,
    address: DataTypes.TEXT,
    notes: DataTypes.TEXT,
    portalUploadsAllowed: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    portalObservationsAllowed: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    portalSitsAllowed: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'clients', modelName: 'Client' },
);
