import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '@/server/db';
import type { BeatLevel } from '@/shared/schemas';
import { decimalBpm } from './decimal';

export type RecordingKind = 'reference' | 'take';
export type AudioFormat = 'mp3' | 'wav' | 'flac' | 'ogg' | 'm4a';
export type AnalysisStatus = 'queued' | 'running' | 'done' | 'failed';

/** An uploaded audio file: someone else's recording (reference) or the player's own (take). */
export class Recording extends Model<InferAttributes<Recording>, InferCreationAttributes<Recording>> {
  declare id: CreationOptional<string>;
  declare songId: string;
  declare ownerId: string;
  declare kind: RecordingKind;
  declare label: string | null;
  declare originalName: string | null;
  declare storageKey: string;
  declare format: AudioFormat;
  declare mimeType: string;
  declare sizeBytes: number;
  declare durationSec: number;
  declare status: CreationOptional<AnalysisStatus>;
  declare progress: CreationOptional<number>;
  declare error: CreationOptional<string | null>;
  declare correctedBpm: CreationOptional<number | null>;
  declare beatOffsetSec: CreationOptional<number | null>;
  /** The metrical level the player feels: half or double the tempo the engine found, the grid moving with it. */
  declare beatLevel: CreationOptional<BeatLevel>;
  /** A beat the player called "one": bars are counted from it. Null: the engine's downbeats. */
  declare barOneSec: CreationOptional<number | null>;
  /** The whole grid moved earlier (negative) or later, in milliseconds. */
  declare nudgeMs: CreationOptional<number>;
  /** Who uploaded it when that was not its owner: a teacher adding a reference to a student's song. */
  declare uploadedBy: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}
Recording.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    songId: { type: DataTypes.UUID, allowNull: false },
    ownerId: { type: DataTypes.STRING(64), allowNull: false },
    kind: { type: DataTypes.ENUM('reference', 'take'), allowNull: false },
    label: { type: DataTypes.STRING(200), allowNull: true },
    originalName: { type: DataTypes.STRING(255), allowNull: true },
    storageKey: { type: DataTypes.STRING(100).BINARY, allowNull: false, unique: true },
    format: { type: DataTypes.ENUM('mp3', 'wav', 'flac', 'ogg', 'm4a'), allowNull: false },
    mimeType: { type: DataTypes.STRING(64), allowNull: false },
    sizeBytes: {
      type: DataTypes.BIGINT,
      allowNull: false,
      get(this: Recording) {
        return Number(this.getDataValue('sizeBytes'));
      },
    },
    durationSec: { type: DataTypes.DOUBLE, allowNull: false },
    status: { type: DataTypes.ENUM('queued', 'running', 'done', 'failed'), allowNull: false, defaultValue: 'queued' },
    progress: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
    error: { type: DataTypes.TEXT, allowNull: true },
    correctedBpm: decimalBpm('correctedBpm'),
    beatOffsetSec: { type: DataTypes.DOUBLE, allowNull: true },
    beatLevel: { type: DataTypes.ENUM('half', 'as-found', 'double'), allowNull: false, defaultValue: 'as-found' },
    barOneSec: { type: DataTypes.DOUBLE, allowNull: true },
    nudgeMs: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    uploadedBy: { type: DataTypes.STRING(64), allowNull: true },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  },
  { sequelize, tableName: 'recordings', modelName: 'Recording' },
);
