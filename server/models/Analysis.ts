import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '@/server/db';

/** What the tempo engine found in a recording (JSON of shared/analysis.ts Analysis), its waveform peaks, and which engine version made them. */
export class Analysis extends Model<InferAttributes<Analysis>, InferCreationAttributes<Analysis>> {
  declare recordingId: string;
  declare result: string;
  declare peaks: string;
  declare engineMs: number;
  declare engineVersion: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}
Analysis.init(
  {
    recordingId: { type: DataTypes.UUID, primaryKey: true },
    result: { type: DataTypes.TEXT('long'), allowNull: false },
    peaks: { type: DataTypes.TEXT('long'), allowNull: false },
    engineMs: { type: DataTypes.INTEGER, allowNull: false },
    engineVersion: { type: DataTypes.INTEGER, allowNull: false },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  },
  { sequelize, tableName: 'analyses', modelName: 'Analysis' },
);
