// Recordings (references and takes) with their stored file, the analysis the engine made of each, and the
// persisted analysis jobs that worker threads of any server process claim.
import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  createdAt: { type: DataTypes.DATE(3), allowNull: false },
  updatedAt: { type: DataTypes.DATE(3), allowNull: false },
};

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('recordings', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    songId: { type: DataTypes.UUID, allowNull: false, references: { model: 'songs', key: 'id' }, onDelete: 'CASCADE' },
    ownerId: {
      type: DataTypes.STRING(64),
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    kind: { type: DataTypes.ENUM('reference', 'take'), allowNull: false },
    label: { type: DataTypes.STRING(200), allowNull: true },
    originalName: { type: DataTypes.STRING(255), allowNull: true },
    storageKey: { type: DataTypes.STRING(100).BINARY, allowNull: false, unique: true },
    format: { type: DataTypes.ENUM('mp3', 'wav', 'flac', 'ogg', 'm4a'), allowNull: false },
    mimeType: { type: DataTypes.STRING(64), allowNull: false },
    sizeBytes: { type: DataTypes.BIGINT, allowNull: false },
    durationSec: { type: DataTypes.DOUBLE, allowNull: false },
    status: { type: DataTypes.ENUM('queued', 'running', 'done', 'failed'), allowNull: false, defaultValue: 'queued' },
    progress: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
    error: { type: DataTypes.TEXT, allowNull: true },
    correctedBpm: { type: DataTypes.DECIMAL(6, 2), allowNull: true },
    beatOffsetSec: { type: DataTypes.DOUBLE, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('recordings', ['songId', 'createdAt']);
  await qi.createTable('analyses', {
    recordingId: {
      type: DataTypes.UUID,
      primaryKey: true,
      allowNull: false,
      references: { model: 'recordings', key: 'id' },
      onDelete: 'CASCADE',
    },
    result: { type: DataTypes.TEXT('long'), allowNull: false },
    peaks: { type: DataTypes.TEXT('long'), allowNull: false },
    engineMs: { type: DataTypes.INTEGER, allowNull: false },
    ...timestamps,
  });
  await qi.createTable('analysis_jobs', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    recordingId: {
      type: DataTypes.UUID,
      allowNull: false,
      unique: true,
      references: { model: 'recordings', key: 'id' },
      onDelete: 'CASCADE',
    },
    status: { type: DataTypes.ENUM('queued', 'running', 'done', 'failed'), allowNull: false, defaultValue: 'queued' },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    lastError: { type: DataTypes.TEXT, allowNull: true },
    lockedBy: { type: DataTypes.STRING(100), allowNull: true },
    heartbeatAt: { type: DataTypes.DATE(3), allowNull: true },
    finishedBy: { type: DataTypes.STRING(100), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('analysis_jobs', ['status', 'createdAt']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('analysis_jobs');
  await qi.dropTable('analyses');
  await qi.dropTable('recordings');
}
