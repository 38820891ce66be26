// Passages: named regions of a recording, kept with the song, each with its own working and goal tempo. A
// practice entry can point at the passage it was played on (and keeps the region itself, so the entry still
// says what was played after the passage is deleted).
import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  createdAt: { type: DataTypes.DATE(3), allowNull: false },
  updatedAt: { type: DataTypes.DATE(3), allowNull: false },
};

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('passages', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    songId: { type: DataTypes.UUID, allowNull: false, references: { model: 'songs', key: 'id' }, onDelete: 'CASCADE' },
    recordingId: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'recordings', key: 'id' },
      onDelete: 'CASCADE',
    },
    name: { type: DataTypes.STRING(120), allowNull: false },
    startSec: { type: DataTypes.DOUBLE, allowNull: false },
    endSec: { type: DataTypes.DOUBLE, allowNull: false },
    startBar: { type: DataTypes.INTEGER, allowNull: true },
    endBar: { type: DataTypes.INTEGER, allowNull: true },
    workingBpm: { type: DataTypes.DECIMAL(6, 2), allowNull: true },
    goalBpm: { type: DataTypes.DECIMAL(6, 2), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('passages', ['songId', 'startSec']);
  const nullable = (type: DataTypes.DataType) => ({ type, allowNull: true });
  await qi.addColumn('practice_entries', 'passageId', {
    ...nullable(DataTypes.UUID),
    references: { model: 'passages', key: 'id' },
    onDelete: 'SET NULL',
  });
  await qi.addColumn('practice_entries', 'recordingId', {
    ...nullable(DataTypes.UUID),
    references: { model: 'recordings', key: 'id' },
    onDelete: 'SET NULL',
  });
  await qi.addColumn('practice_entries', 'startSec', nullable(DataTypes.DOUBLE));
  await qi.addColumn('practice_entries', 'endSec', nullable(DataTypes.DOUBLE));
  await qi.addColumn('practice_entries', 'startBar', nullable(DataTypes.INTEGER));
  await qi.addColumn('practice_entries', 'endBar', nullable(DataTypes.INTEGER));
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const column of ['endBar', 'startBar', 'endSec', 'startSec', 'recordingId', 'passageId'])
    await qi.removeColumn('practice_entries', column);
  await qi.dropTable('passages');
}
