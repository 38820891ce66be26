// umzug over Sequelize: the migrations folder owns the whole schema, sign-in tables included.
import path from 'node:path';
import { Umzug, SequelizeStorage } from 'umzug';
import { sequelize } from './db';

export const migrator = new Umzug({
  migrations: {
    glob: ['migrations/*.{ts,js}', { cwd: __dirname, ignore: ['**/*.d.ts'] }],
    resolve: ({ name, path: file, context }) => {
      // eslint-disable-next-line @typescript-eslint/no-require-imports
      const migration = require(file!);
      return {
        name: path.basename(name, path.extname(name)),
        up: () => migration.up({ context }),
        down: () => migration.down({ context }),
      };
    },
  },
  context: sequelize.getQueryInterface(),
  storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
  logger: undefined,
});

/**
 * Applies pending migrations (up to and including `to`, when given); an advisory lock keeps two starting
 * processes from migrating at once.
 */
export async function migrate(to?: string): Promise<string[]> {
  const [[{ got }]] = (await sequelize.query("SELECT GET_LOCK('tactus_migrate', 60) AS got")) as [
    [{ got: number }],
    unknown,
  ];
  if (got !== 1) throw new Error('could not take the migration lock within 60 s');
  try {
    const done = await migrator.up(to ? { to } : undefined);
    return done.map((m) => m.name);
  } finally {
    await sequelize.query("SELECT RELEASE_LOCK('tactus_migrate')");
  }
}
