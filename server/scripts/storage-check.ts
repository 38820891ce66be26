// `npm run storage:check [-- --fix] [--older-than-minutes=60] [--json]`: stored objects against recording
// rows on the configured driver (TACTUS_STORAGE), orphans listed both ways; --fix removes orphaned objects
// older than the given age (an hour by default). Exits 1 when a row's object is missing.
import { sequelize } from '@/server/db';
import { config } from '@/server/config';
import { checkStorage } from '@/server/services/storage-check';

async function main() {
  const args = process.argv.slice(2);
  const fix = args.includes('--fix');
  const json = args.includes('--json');
  const minutes = Number(
    /^--older-than-minutes=(\d+(?:\.\d+)?)$/.exec(args.find((a) => a.startsWith('--older')) ?? '')?.[1] ?? 60,
  );
  const report = await checkStorage({ fix, olderThanMs: minutes * 60_000 });
  await sequelize.close();
  if (json) console.log(JSON.stringify(report));
  else {
    const where = config.storage.driver === 's3' ? `bucket ${config.storage.s3.bucket}` : config.storage.dir;
    console.log(`${report.objects} stored objects in ${where}, ${report.rows} recording rows in ${config.db.name}`);
    console.log(`objects no recording names: ${report.orphanObjects.length}`);
    for (const o of report.orphanObjects) {
      const age = Math.round((Date.now() - o.modifiedAt.getTime()) / 60_000);
      console.log(
        `  ${o.key}  ${o.sizeBytes} bytes, ${age} min old${o.removed ? '  removed' : fix ? '  kept (younger than the limit)' : ''}`,
      );
    }
    console.log(`recordings whose object is missing: ${report.missingObjects.length}`);
    for (const m of report.missingObjects) console.log(`  recording ${m.recordingId} (object ${m.storageKey})`);
    if (!fix && report.orphanObjects.length)
      console.log(`run with --fix to remove orphaned objects older than ${minutes} min`);
  }
  process.exitCode = report.missingObjects.length ? 1 : 0;
}

main().catch((err) => {
  console.error('[tactus] storage check failed:', err);
  process.exit(2);
});
