// A practice entry's note: what the player wants to remember of the session ("left hand tense at bar 12").
import { DataTypes, type QueryInterface } from 'sequelize';

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('practice_entries', 'note', { type: DataTypes.STRING(1000), allowNull: true });
  // The whole log of a player, oldest first, for the export and the weekly summary.
  await qi.addIndex('practice_entries', ['userId', 'createdAt']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeIndex('practice_entries', ['userId', 'createdAt']);
  await qi.removeColumn('practice_entries', 'note');
}
