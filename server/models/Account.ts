import { DataTypes, Model } from 'sequelize';
import { sequelize } from '@/server/db';

/** A way of signing in (here: e-mail and a password hash). Written by better-auth. */
export class Account extends Model {}
Account.init(
  {
    id: { type: DataTypes.STRING(64), primaryKey: true },
    userId: { type: DataTypes.STRING(64), allowNull: false },
    accountId: { type: DataTypes.STRING(255), allowNull: false },
    providerId: { type: DataTypes.STRING(64), allowNull: false },
    accessToken: { type: DataTypes.TEXT, allowNull: true },
    refreshToken: { type: DataTypes.TEXT, allowNull: true },
    idToken: { type: DataTypes.TEXT, allowNull: true },
    accessTokenExpiresAt: { type: DataTypes.DATE(3), allowNull: true },
    refreshTokenExpiresAt: { type: DataTypes.DATE(3), allowNull: true },
    scope: { type: DataTypes.TEXT, allowNull: true },
    password: { type: DataTypes.TEXT, allowNull: true },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  },
  { sequelize, tableName: 'accounts', modelName: 'Account' },
);
