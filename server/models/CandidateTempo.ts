import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '@/server/db';
import { decimalBpm } from './decimal';

/** A tempo the player is trying out for a song, with a rating (1–5) and a line of text. */
export class CandidateTempo extends Model<InferAttributes<CandidateTempo>, InferCreationAttributes<CandidateTempo>> {
  declare id: CreationOptional<string>;
  declare songId: string;
  declare bpm: number;
  declare rating: number | null;
  declare note: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}
CandidateTempo.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    songId: { type: DataTypes.UUID, allowNull: false },
    bpm: decimalBpm('bpm', false),
    rating: { type: DataTypes.TINYINT, allowNull: true },
    note: { type: DataTypes.STRING(500), allowNull: true },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  },
  { sequelize, tableName: 'candidate_tempos', modelName: 'CandidateTempo' },
);
