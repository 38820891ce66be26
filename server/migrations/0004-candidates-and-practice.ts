// Candidate tempos a player tries for a song (rated, with a line of text), the note on the chosen tempo, and
// practice entries (one logged session: tempo reached, repetitions, minutes).
import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  createdAt: { type: DataTypes.DATE(3), allowNull: false },
  updatedAt: { type: DataTypes.DATE(3), allowNull: false },
};
const songRef = {
  type: DataTypes.UUID,
  allowNull: false,
  references: { model: 'songs', key: 'id' },
  onDelete: 'CASCADE',
};

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('songs', 'chosenNote', { type: DataTypes.TEXT, allowNull: true });
  await qi.createTable('candidate_tempos', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    songId: songRef,
    bpm: { type: DataTypes.DECIMAL(6, 2), allowNull: false },
    rating: { type: DataTypes.TINYINT, allowNull: true },
    note: { type: DataTypes.STRING(500), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('candidate_tempos', ['songId', 'bpm']);
  await qi.createTable('practice_entries', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    songId: songRef,
    userId: {
      type: DataTypes.STRING(64),
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    passage: { type: DataTypes.STRING(200), allowNull: true },
    startBpm: { type: DataTypes.DECIMAL(6, 2), allowNull: false },
    reachedBpm: { type: DataTypes.DECIMAL(6, 2), allowNull: false },
    repetitions: { type: DataTypes.INTEGER, allowNull: false },
    minutes: { type: DataTypes.FLOAT, allowNull: false },
    clean: { type: DataTypes.BOOLEAN, allowNull: false },
    ...timestamps,
  });
  await qi.addIndex('practice_entries', ['songId', 'createdAt']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('practice_entries');
  await qi.dropTable('candidate_tempos');
  await qi.removeColumn('songs', 'chosenNote');
}
