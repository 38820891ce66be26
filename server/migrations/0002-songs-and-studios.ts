// Songs with their goal, working and chosen tempos, and the teacher-student links that make a studio.
import { DataTypes, type QueryInterface } from 'sequelize';

const userRef = {
  type: DataTypes.STRING(64),
  allowNull: false,
  references: { model: 'users', key: 'id' },
  onDelete: 'CASCADE',
};
const timestamps = {
  createdAt: { type: DataTypes.DATE(3), allowNull: false },
  updatedAt: { type: DataTypes.DATE(3), allowNull: false },
};
const bpm = { type: DataTypes.DECIMAL(6, 2), allowNull: true };

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('songs', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    ownerId: userRef,
    title: { type: DataTypes.STRING(200), allowNull: false },
    composer: { type: DataTypes.STRING(200), allowNull: true },
    meter: { type: DataTypes.STRING(8), allowNull: false, defaultValue: '4/4' },
    goalBpm: bpm,
    workingBpm: bpm,
    chosenBpm: bpm,
    notes: { type: DataTypes.TEXT, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('songs', ['ownerId', 'updatedAt']);
  await qi.createTable('studio_links', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    teacherId: userRef,
    studentId: userRef,
    ...timestamps,
  });
  await qi.addIndex('studio_links', ['teacherId', 'studentId'], { unique: true });
  await qi.addIndex('studio_links', ['studentId']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('studio_links');
  await qi.dropTable('songs');
}
