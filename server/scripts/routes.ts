// Prints every /api route the app mounts, one `METHOD path` a line (`--json` for the list as JSON):
// the listing the OpenAPI test compares with the document. Builds the app without listening or connecting.
import { createApp } from '@/server/app';
import { listRoutes } from '@/server/route-table';

const routes = listRoutes(createApp());
const text = process.argv.includes('--json')
  ? `${JSON.stringify(routes)}\n`
  : routes.map((r) => `${r.method} ${r.path}\n`).join('');
// better-auth and Sequelize may hold handles open although nothing was connected; the listing is all we came for.
process.stdout.write(text, () => process.exit(0));
