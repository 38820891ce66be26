// Rate-limit counters (rate-limiter-flexible's MySQL store): one row per key, shared by every server process.
import { DataTypes, type QueryInterface } from 'sequelize';

export async function up({ context: qi }: { context: QueryInterface }) {
  // The columns the store reads and writes: `key`, `points`, `expire` (epoch milliseconds, null = never).
  await qi.createTable('rate_limits', {
    key: { type: DataTypes.STRING(255), primaryKey: true, allowNull: false },
    points: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    expire: { type: DataTypes.BIGINT.UNSIGNED, allowNull: true },
  });
  await qi.addIndex('rate_limits', ['expire']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('rate_limits');
}
