import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@/server/db';
import type { Role, StretchMethod } from '@/shared/schemas';

/** A person who signs in. better-auth writes these rows through the adapter in auth-adapter.ts. */
export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: string;
  declare name: string;
  declare email: string;
  declare emailVerified: boolean;
  declare image: string | null;
  declare role: Role;
  /** Wants the e-mail digest of new notes on their recordings (on unless turned off in Account). */
  declare noteDigests: CreationOptional<boolean>;
  declare lastDigestAt: CreationOptional<Date | null>;
  /** How the player stretches time for them (the phase vocoder unless they choose overlap-add). */
  declare stretchMethod: CreationOptional<StretchMethod>;
  declare createdAt: Date;
  declare updatedAt: Date;
}
User.init(
  {
    id: { type: DataTypes.STRING(64), primaryKey: true },
    name: { type: DataTypes.STRING(200), allowNull: false },
    email: { type: DataTypes.STRING(320), allowNull: false, unique: true },
    emailVerified: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    image: { type: DataTypes.TEXT, allowNull: true },
    role: { type: DataTypes.ENUM('player', 'teacher', 'admin'), allowNull: false, defaultValue: 'player' },
    noteDigests: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    lastDigestAt: { type: DataTypes.DATE(3), allowNull: true },
    stretchMethod: {
      type: DataTypes.ENUM('phase-vocoder', 'overlap-add'),
      allowNull: false,
      defaultValue: 'phase-vocoder',
    },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  },
  { sequelize, tableName: 'users', modelName: 'User' },
);
