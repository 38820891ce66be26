// A local S3-compatible server (s3rver) on loopback, for development and tests of the S3 storage driver.
// `tsx server/dev/fake-s3.ts` runs it until stopped; its data lives under TACTUS_STATE.
import path from 'node:path';
import { config } from '@/server/config';

// eslint-disable-next-line @typescript-eslint/no-require-imports
const S3rver = require('s3rver');

const port = Number(new URL(config.storage.s3.endpoint).port || 4569);
const directory =
  process.env.TACTUS_FAKE_S3_DIR ?? path.join(process.env.TACTUS_STATE ?? path.join(config.root, '.tactus'), 'fake-s3');

new S3rver({
  port,
  address: '127.0.0.1',
  directory,
  silent: true,
  configureBuckets: [{ name: config.storage.s3.bucket }],
})
  .run()
  .then(() => console.log(`[tactus] fake S3 on http://127.0.0.1:${port}, bucket ${config.storage.s3.bucket}`))
  .catch((err: NodeJS.ErrnoException) => {
    if (err.code === 'EADDRINUSE') {
      console.log(`[tactus] fake S3 already listening on port ${port}`);
      process.exit(0);
    }
    console.error(err);
    process.exit(1);
  });
