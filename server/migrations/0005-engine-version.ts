// Each analysis records the engine version that made it, and jobs get a priority so that re-analysing old
// recordings after an engine change waits behind new uploads.
import { DataTypes, type QueryInterface } from 'sequelize';

export async function up({ context: qi }: { context: QueryInterface }) {
  // Every analysis stored before this column existed was made by engine version 1.
  await qi.addColumn('analyses', 'engineVersion', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 });
  // 0: a new upload the player is waiting for; 1: a background re-analysis.
  await qi.addColumn('analysis_jobs', 'priority', { type: DataTypes.TINYINT, allowNull: false, defaultValue: 0 });
  await qi.addIndex('analysis_jobs', ['status', 'priority', 'createdAt']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeIndex('analysis_jobs', ['status', 'priority', 'createdAt']);
  await qi.removeColumn('analysis_jobs', 'priority');
  await qi.removeColumn('analyses', 'engineVersion');
}
