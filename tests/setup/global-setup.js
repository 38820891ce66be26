// Before any test: a fresh tactus_test database, a mail catcher and the real server on free loopback ports.
// Expects MariaDB up (scripts/test.sh runs scripts/mariadb.sh first).
const { spawn } = require('node:child_process');
const fs = require('node:fs');
const net = require('node:net');
const path = require('node:path');
const mariadb = require('mariadb');

const root = path.resolve(__dirname, '../..');
const tsx = path.join(root, 'node_modules/.bin/tsx');

const freePort = () =>
  new Promise((resolve, reject) => {
    const s = net.createServer();
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address();
      s.close(() => resolve(port));
    });
    s.on('error', reject);
  });

async function waitFor(url, ms) {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    try {
      const res = await fetch(url);
      if (res.ok) return;
    } catch {}
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`${url} did not answer within ${ms} ms`);
}

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
  const conn = await mariadb.createConnection(db);
  await conn.query('DROP DATABASE IF EXISTS tactus_test');
  await conn.query('CREATE DATABASE tactus_test CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci');
  await conn.end();

  const [port, smtpPort] = [await freePort(), await freePort()];
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
  };
  Object.assign(process.env, {
    TACTUS_TEST_URL: env.TACTUS_PUBLIC_URL,
    TACTUS_TEST_MAIL_DIR: mailDir,
    TACTUS_TEST_SMTP_PORT: env.TACTUS_SMTP_PORT,
    TACTUS_DB_NAME: 'tactus_test',
  });

  const start = (script, name) => {
    const out = fs.openSync(path.join(state, 'logs', `test-${name}.log`), 'w');
    return spawn(tsx, [path.join(root, script)], { env, stdio: ['ignore', out, out], cwd: root });
  };
  globalThis.__tactusChildren = [start('server/mail/catcher-cli.ts', 'mail'), start('server/index.ts', 'server')];
  await waitFor(`${env.TACTUS_PUBLIC_URL}/api/health`, 60_000);
};
