import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '@/server/db';
import type { AnalysisStatus } from './Recording';

/** One analysis to run; claimed by a server process with SELECT … FOR UPDATE SKIP LOCKED (jobs/queue.ts). */
export class AnalysisJob extends Model<InferAttributes<AnalysisJob>, InferCreationAttributes<AnalysisJob>> {
  declare id: CreationOptional<string>;
  declare recordingId: string;
  declare status: CreationOptional<AnalysisStatus>;
  declare attempts: CreationOptional<number>;
  /** 0: a new upload; 1: a background re-analysis (after an engine change), taken only when nothing else waits. */
  declare priority: CreationOptional<number>;
  declare lastError: CreationOptional<string | null>;
  declare lockedBy: CreationOptional<string | null>;
  declare heartbeatAt: CreationOptional<Date | null>;
  declare finishedBy: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}
AnalysisJob.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    recordingId: { type: DataTypes.UUID, allowNull: false, unique: true },
    status: { type: DataTypes.ENUM('queued', 'running', 'done', 'failed'), allowNull: false, defaultValue: 'queued' },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    priority: { type: DataTypes.TINYINT, allowNull: false, defaultValue: 0 },
    lastError: { type: DataTypes.TEXT, allowNull: true },
    lockedBy: { type: DataTypes.STRING(100), allowNull: true },
    heartbeatAt: { type: DataTypes.DATE(3), allowNull: true },
    finishedBy: { type: DataTypes.STRING(100), allowNull: true },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  },
  { sequelize, tableName: 'analysis_jobs', modelName: 'AnalysisJob' },
);
