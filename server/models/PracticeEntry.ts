import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '@/server/db';
import { decimalBpm } from './decimal';

/** One logged practice session on a song (or a passage of it). */
export class PracticeEntry extends Model<InferAttributes<PracticeEntry>, InferCreationAttributes<PracticeEntry>> {
  declare id: CreationOptional<string>;
  declare songId: string;
  declare userId: string;
  /** What was played, in words ("bridge", "bars 5–8"); null for the whole piece. */
  declare passage: string | null;
  declare passageId: string | null;
  declare recordingId: string | null;
  declare startSec: number | null;
  declare endSec: number | null;
  declare startBar: number | null;
  declare endBar: number | null;
  declare startBpm: number;
  declare reachedBpm: number;
  declare repetitions: number;
  declare minutes: number;
  declare clean: boolean;
  /** What the player wants to remember of the session. */
  declare note: string | null;
  /** When the session was played: the moment it was logged, or the day given for one logged later. */
  declare createdAt: CreationOptional<Date>;
  /** When it was logged (an entry is never edited). */
  declare updatedAt: CreationOptional<Date>;
}
PracticeEntry.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    songId: { type: DataTypes.UUID, allowNull: false },
    userId: { type: DataTypes.STRING(64), allowNull: false },
    passage: { type: DataTypes.STRING(200), allowNull: true },
    passageId: { type: DataTypes.UUID, allowNull: true },
    recordingId: { type: DataTypes.UUID, allowNull: true },
    startSec: { type: DataTypes.DOUBLE, allowNull: true },
    endSec: { type: DataTypes.DOUBLE, allowNull: true },
    startBar: { type: DataTypes.INTEGER, allowNull: true },
    endBar: { type: DataTypes.INTEGER, allowNull: true },
    startBpm: decimalBpm('startBpm', false),
    reachedBpm: decimalBpm('reachedBpm', false),
    repetitions: { type: DataTypes.INTEGER, allowNull: false },
    minutes: { type: DataTypes.FLOAT, allowNull: false },
    clean: { type: DataTypes.BOOLEAN, allowNull: false },
    note: { type: DataTypes.STRING(1000), allowNull: true },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  },
  { sequelize, tableName: 'practice_entries', modelName: 'PracticeEntry' },
);
