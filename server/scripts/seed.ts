import { migrate } from '@/server/migrator';
import { sequelize } from '@/server/db';
import { demoSignInTable, seedDemo } from '@/server/seed';

(async () => {
  await migrate();
  const { created } = await seedDemo();
  console.log(created ? '[tactus] demo studio seeded' : '[tactus] demo studio already present');
  console.log(demoSignInTable());
  await sequelize.close();
})().catch((err) => {
  console.error('[tactus] seeding failed:', err);
  process.exit(1);
});
