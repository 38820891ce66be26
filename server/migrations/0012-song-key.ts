// A song's musical key ("D minor", "B♭ major", "E Dorian"): free text, as players write it on a chart.
import { DataTypes, type QueryInterface } from 'sequelize';

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('songs', 'key', { type: DataTypes.STRING(40), allowNull: true });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('songs', 'key');
}
