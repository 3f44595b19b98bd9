import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import type { Role } from '../../shared/schemas/auth';

/** A person who signs in: firm staff, crew, or a client contact (linked to one client). */
export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare firmId: number;
  declare clientId: number | null;
  declare email: string;
  declare name: string;
  declare role: Role;
  declare phone: string | null;
  declare passwordHash: string | null;
  declare active: CreationOptional<boolean>;
  /** False only for a signed-up owner who has not yet opened the confirmation link. */
  declare emailVerified: CreationOptional<boolean>;
  declare lastSignInAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

User.init(
  {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    firmId: { type: DataTypes.INTEGER, allowNull: false },
    clientId: DataTypes.INTEGER,
    email: { type: DataTypes.TEXT, allowNull: false },
    name: { type: DataTypes.TEXT, allowNull: false },
    role: { type: DataTypes.TEXT, allowNull: false },
    phone: DataTypes.TEXT,
    passwordHash: DataTypes.TEXT,
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    emailVerified: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    lastSignInAt: DataTypes.DATE,
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'users', modelName: 'User' },
);
