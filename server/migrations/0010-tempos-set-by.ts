// Who set a song's (or passage's) working and goal tempo, and when: the player, or their teacher. And who
// uploaded a recording, when it was not its owner (a teacher adding a reference to a student's song).
import { DataTypes, type QueryInterface } from 'sequelize';

const userRef = {
  type: DataTypes.STRING(64),
  allowNull: true,
  references: { model: 'users', key: 'id' },
  onDelete: 'SET NULL',
};
const when = { type: DataTypes.DATE(3), allowNull: true };

export async function up({ context: qi }: { context: QueryInterface }) {
  for (const table of ['songs', 'passages']) {
    await qi.addColumn(table, 'workingSetBy', userRef);
    await qi.addColumn(table, 'workingSetAt', when);
    await qi.addColumn(table, 'goalSetBy', userRef);
    await qi.addColumn(table, 'goalSetAt', when);
  }
  await qi.addColumn('recordings', 'uploadedBy', userRef);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('recordings', 'uploadedBy');
  for (const table of ['songs', 'passages']) {
    for (const column of ['goalSetAt', 'goalSetBy', 'workingSetAt', 'workingSetBy'])
      await qi.removeColumn(table, column);
  }
}
