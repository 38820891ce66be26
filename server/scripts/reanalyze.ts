// npm run reanalyze: queue a background re-analysis of every recording an older engine version analysed
// (`-- --all`: of every analysed recording). Any running server takes the jobs up behind new uploads; with
// none running, the next server to start does. Corrections the players made are kept.
import { sequelize } from '@/server/db';
import { queueReanalyses } from '@/server/jobs/queue';
import { ENGINE_VERSION } from '@/audio/analysis/version';

const all = process.argv.includes('--all');
queueReanalyses(ENGINE_VERSION, { all })
  .then((n) =>
    console.log(
      `[tactus] ${n} recording(s) queued for re-analysis by engine version ${ENGINE_VERSION}${all ? ' (all)' : ''}`,
    ),
  )
  .catch((err) => {
    console.error(`[tactus] could not queue re-analyses: ${(err as Error).message}`);
    process.exitCode = 1;
  })
  .finally(() => sequelize.close());
