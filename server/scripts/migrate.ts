// npm run migrate [-- --to NAME]: apply the pending migrations (or those up to NAME, e.g. 0006-passages).
import { migrate } from '@/server/migrator';
import { sequelize } from '@/server/db';

const at = process.argv.indexOf('--to');
const to = at >= 0 ? process.argv[at + 1] : undefined;

migrate(to)
  .then((names) =>
    console.log(names.length ? `[tactus] applied migrations: ${names.join(', ')}` : '[tactus] schema up to date'),
  )
  .catch((err) => {
    console.error(`[tactus] migration failed: ${(err as Error).message}`);
    process.exitCode = 1;
  })
  .finally(() => sequelize.close());
