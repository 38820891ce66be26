// Before any test: a fresh tactus_test database, a mail catcher and the real server on free loopback ports.
// Expects MariaDB up (scripts/test.sh runs scripts/mariadb.sh first).
const fs = require('node:fs');
const path = require('node:path');
const mariadb = require('mariadb');
const { freePort, root, spawnTs, waitForOk } = require('./processes');
const { devStateFingerprint } = require('./dev-state');

module.exports = async function globalSetup() {
  const state = process.env.TACTUS_STATE || path.join(root, '.tactus');
  const mailDir = path.join(state, 'test-mail');
  fs.rmSync(mailDir, { recursive: true, force: true });
  fs.mkdirSync(path.join(state, 'logs'), { recursive: true });

  const db = {
    host: '127.0.0.1',
    port: Number(process.env.TACTUS_DB_PORT || 3406),
    user: process.env.TACTUS_DB_USER || 'tactus',
    password: process.env.TACTUS_DB_PASSWORD || 'tactus-local',
  };
  // What npm start's development state looks like now; global-teardown and tests/api/dev-state.test.ts compare.
  const devState = await devStateFingerprint(state, db);

  const conn = await mariadb.createConnection(db);
  // tactus_test for the server that stores files on disk, tactus_test_s3 for the one that uses the fake S3
  // (one database, one object store: processes that share a database must share where its files live).
  for (const name of ['tactus_test', 'tactus_test_s3']) {
    await conn.query(`DROP DATABASE IF EXISTS ${name}`);
    await conn.query(`CREATE DATABASE ${name} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  }
  await conn.end();

  const [port, smtpPort, s3Port, s3ServerPort] = [
    await freePort(),
    await freePort(),
    await freePort(),
    await freePort(),
  ];
  const disk = path.join(state, 'test-disk');
  const s3 = path.join(state, 'test-s3');
  for (const dir of [disk, s3]) fs.rmSync(dir, { recursive: true, force: true });
  const env = {
    ...process.env,
    NODE_ENV: 'test',
    TACTUS_ROOT: root,
    TACTUS_STATE: state,
    TACTUS_DB_NAME: 'tactus_test',
    TACTUS_PORT: String(port),
    TACTUS_PUBLIC_URL: `http://127.0.0.1:${port}`,
    TACTUS_SMTP_PORT: String(smtpPort),
    TACTUS_MAIL_DIR: mailDir,
    TACTUS_SERVE_WEB: '1',
    // Small limits so the oversize test sends megabytes, not hundreds of them.
    TACTUS_MAX_UPLOAD_BYTES: String(8 * 1024 * 1024),
    // Digests gather notes for 1.5 s instead of 2 minutes (the 15-minute gap between two digests stays).
    TACTUS_DIGEST_GATHER_MS: '1500',
    TACTUS_DIGEST_POLL_MS: '1000',
    TACTUS_STORAGE: 'disk',
    TACTUS_STORAGE_DIR: path.join(disk, 'recordings'),
    TACTUS_SPOOL_DIR: path.join(disk, 'spool'),
    TACTUS_S3_ENDPOINT: `http://127.0.0.1:${s3Port}`,
    TACTUS_S3_BUCKET: 'tactus-test',
    TACTUS_FAKE_S3_DIR: path.join(s3, 'objects'),
  };
  // A second server on the same database that keeps its files in the fake S3.
  const s3Env = {
    ...env,
    TACTUS_PORT: String(s3ServerPort),
    TACTUS_PUBLIC_URL: `http://127.0.0.1:${s3ServerPort}`,
    TACTUS_STORAGE: 's3',
    TACTUS_SPOOL_DIR: path.join(s3, 'spool'),
    TACTUS_DB_NAME: 'tactus_test_s3',
  };
  Object.assign(process.env, {
    TACTUS_TEST_URL: env.TACTUS_PUBLIC_URL,
    TACTUS_TEST_S3_URL: s3Env.TACTUS_PUBLIC_URL,
    TACTUS_TEST_DISK_DIR: env.TACTUS_STORAGE_DIR,
    TACTUS_TEST_DISK_SPOOL: env.TACTUS_SPOOL_DIR,
    TACTUS_TEST_S3_SPOOL: s3Env.TACTUS_SPOOL_DIR,
    TACTUS_TEST_S3_ENDPOINT: env.TACTUS_S3_ENDPOINT,
    TACTUS_TEST_S3_BUCKET: env.TACTUS_S3_BUCKET,
    TACTUS_TEST_MAX_UPLOAD: env.TACTUS_MAX_UPLOAD_BYTES,
    TACTUS_TEST_SERVER_ENV: JSON.stringify(env),
    TACTUS_TEST_MAIL_DIR: mailDir,
    TACTUS_TEST_SMTP_PORT: env.TACTUS_SMTP_PORT,
    TACTUS_DB_NAME: 'tactus_test',
    TACTUS_TEST_DEV_STATE: JSON.stringify(devState),
    TACTUS_TEST_DB: JSON.stringify(db),
    // Anything a test starts without its own settings (the seed script, the analyze command) gets the test
    // server's folders, never the development ones.
    TACTUS_STORAGE_DIR: env.TACTUS_STORAGE_DIR,
    TACTUS_SPOOL_DIR: env.TACTUS_SPOOL_DIR,
    TACTUS_MAIL_DIR: mailDir,
    TACTUS_SMTP_PORT: env.TACTUS_SMTP_PORT,
  });

  const start = (script, name, childEnv = env) => {
    const out = fs.openSync(path.join(state, 'logs', `test-${name}.log`), 'w');
    return spawnTs(script, childEnv, ['ignore', out, out]);
  };
  globalThis.__tactusChildren = [
    start('server/mail/catcher-cli.ts', 'mail'),
    start('server/dev/fake-s3.ts', 'fake-s3'),
  ];
  globalThis.__tactusChildren.push(start('server/index.ts', 'server'), start('server/index.ts', 'server-s3', s3Env));
  await Promise.all([
    waitForOk(`${env.TACTUS_PUBLIC_URL}/api/health`, 90_000),
    waitForOk(`${s3Env.TACTUS_PUBLIC_URL}/api/health`, 90_000),
  ]);
};
