// The player's corrections of the beat grid, kept on the recording (so a re-analysis keeps them): the metrical
// level they feel (half or double the tempo found, the grid moving with it), which beat is "one", and a nudge
// of the whole grid earlier or later.
import { DataTypes, type QueryInterface } from 'sequelize';

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('recordings', 'beatLevel', {
    type: DataTypes.ENUM('half', 'as-found', 'double'),
    allowNull: false,
    defaultValue: 'as-found',
  });
  await qi.addColumn('recordings', 'barOneSec', { type: DataTypes.DOUBLE, allowNull: true });
  await qi.addColumn('recordings', 'nudgeMs', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('recordings', 'nudgeMs');
  await qi.removeColumn('recordings', 'barOneSec');
  await qi.removeColumn('recordings', 'beatLevel');
}
