import { migrate } from '@/server/migrator';
import { sequelize } from '@/server/db';

migrate()
  .then((names) => console.log(names.length ? `[tactus] applied migrations: ${names.join(', ')}` : '[tactus] schema up to date'))
  .finally(() => sequelize.close());
