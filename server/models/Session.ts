import { DataTypes, Model } from 'sequelize';
import { sequelize } from '@/server/db';

/** A signed-in browser. Written by better-auth. */
export class Session extends Model {}
Session.init(
  {
    id: { type: DataTypes.STRING(64), primaryKey: true },
    userId: { type: DataTypes.STRING(64), allowNull: false },
    token: { type: DataTypes.STRING(255).BINARY, allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE(3), allowNull: false },
    ipAddress: { type: DataTypes.STRING(64), allowNull: true },
    userAgent: { type: DataTypes.TEXT, allowNull: true },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  },
  { sequelize, tableName: 'sessions', modelName: 'Session' },
);
