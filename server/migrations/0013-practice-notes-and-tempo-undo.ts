// A practice entry's note: what the player wants to remember of the session ("left hand tense at bar 12"). And
// the working tempo a change replaced (with who set it and when) on songs and passages, so Undo puts it back as
// it was, a teacher's name included.
import { DataTypes, type QueryInterface } from 'sequelize';

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('practice_entries', 'note', { type: DataTypes.STRING(1000), allowNull: true });
  // The whole log of a player, oldest first, for the export and the weekly summary.
  await qi.addIndex('practice_entries', ['userId', 'createdAt']);
  for (const table of ['songs', 'passages'])
    await qi.addColumn(table, 'previousWorking', { type: DataTypes.STRING(200), allowNull: true });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const table of ['songs', 'passages']) await qi.removeColumn(table, 'previousWorking');
  await qi.removeIndex('practice_entries', ['userId', 'createdAt']);
  await qi.removeColumn('practice_entries', 'note');
}
