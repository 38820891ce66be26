import { DataTypes, Model } from 'sequelize';
import { sequelize } from '@/server/db';

/** One-time values for e-mail verification and password reset. Written by better-auth. */
export class Verification extends Model {}
Verification.init(
  {
    id: { type: DataTypes.STRING(64), primaryKey: true },
    identifier: { type: DataTypes.STRING(255).BINARY, allowNull: false },
    value: { type: DataTypes.TEXT, allowNull: false },
    expiresAt: { type: DataTypes.DATE(3), allowNull: false },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  },
  { sequelize, tableName: 'verifications', modelName: 'Verification' },
);
