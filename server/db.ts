// The one Sequelize instance. Models register themselves on it in models/index.ts.
import { Sequelize } from 'sequelize';
import mariadb from 'mariadb';
import { config } from './config';

export const sequelize = new Sequelize(config.db.name, config.db.user, config.db.password, {
  host: config.db.host,
  port: config.db.port,
  dialect: 'mariadb',
  dialectModule: mariadb,
  logging: false,
  timezone: '+00:00',
  dialectOptions: { connectTimeout: 5000 },
  pool: { max: 10, min: 0, idle: 10_000 },
  define: { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
});

export async function databaseState(): Promise<'up' | 'down'> {
  try {
    await sequelize.query('SELECT 1');
    return 'up';
  } catch {
    return 'down';
  }
}
