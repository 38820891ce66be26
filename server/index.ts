// Starts the server: migrate, then listen. Set TACTUS_SERVE_WEB=1 (or NODE_ENV=production) to serve dist/.
import { config } from './config';
import { createApp } from './app';
import { migrate } from './migrator';
import { sequelize } from './db';
import { startAnalysisRunner } from '@/server/jobs/runner';
import { queueReanalyses } from '@/server/jobs/queue';
import { ENGINE_VERSION } from '@/audio/analysis/version';
import { cleanSpool } from '@/server/middleware/upload';
import { checkPool } from '@/server/analysis/check-pool';
import { startDigests, stopDigests } from '@/server/services/digests';
import { startProcessStats } from './log';

/** Settings production cannot do without; the server says which and does not start. */
function productionProblems(): string[] {
  if (!config.production) return [];
  const problems: string[] = [];
  if (!config.authSecretSet)
    problems.push('TACTUS_AUTH_SECRET is not set (sessions would be signed with a public key)');
  else if (config.authSecret.length < 32) problems.push('TACTUS_AUTH_SECRET is shorter than 32 characters');
  return problems;
}

async function main() {
  const problems = productionProblems();
  if (problems.length) {
    console.error(`[tactus] will not start in production: ${problems.join('; ')}`);
    process.exit(1);
  }
  const applied = await migrate();
  if (applied.length) console.log(`[tactus] applied migrations: ${applied.join(', ')}`);
  cleanSpool();
  // Recordings analysed by an older engine are analysed again in the background, behind new uploads.
  const outdated = await queueReanalyses(ENGINE_VERSION);
  if (outdated) console.log(`[tactus] ${outdated} recording(s) analysed by an older engine queued for re-analysis`);
  // Queued jobs, and jobs whose process died mid-way, are picked up again from the table.
  const runner = startAnalysisRunner();
  checkPool().warm();
  startDigests();
  const stopStats = startProcessStats(config.log.processStatsMs);
  const serveWeb = config.production || process.env.TACTUS_SERVE_WEB === '1';
  const app = createApp({ serveWeb });
  const server = app.listen(config.port, '127.0.0.1', () => {
    console.log(`[tactus] serving ${serveWeb ? 'the app and ' : ''}the API at ${config.publicUrl}`);
    if (config.devTools)
      console.log(
        `[tactus] development helpers are on (caught mail at /dev/mail, API docs at /api/docs); ` +
          `they are never mounted with NODE_ENV=production`,
      );
    if (config.log.file) console.log(`[tactus] request log: ${config.log.file}`);
  });
  const stop = () => {
    stopDigests();
    stopStats();
    server.close(
      () =>
        void runner
          .stop()
          .then(() => sequelize.close())
          .then(() => process.exit(0)),
    );
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
}

main().catch((err) => {
  console.error('[tactus] could not start:', err);
  process.exit(1);
});
