// Faults, on server processes of their own (the shared test servers and MariaDB are never touched):
//  - kill -9 of a server while uploads stream in and analyses run, then a restart: every upload it had
//    acknowledged is there with its file and is analysed exactly once;
//  - the database cut off mid-run (a TCP proxy between the server and MariaDB, closed and reopened): clear
//    503s, no crash, and recovery on its own when the database is back.
import type { ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import mariadb from 'mariadb';
import { agent, linkPath, PASSWORD, query, uniqueEmail, waitForMail } from './helpers';
import { freePort, root, spawnTs, waitForOk } from '@/tests/setup/processes';

const CLIP = fs.readFileSync(path.join(root, 'fixtures/clips/waltz-150.mp3'));
const work = fs.mkdtempSync(path.join(os.tmpdir(), 'tactus-faults-'));
const children: ChildProcess[] = [];
const dbPort = Number(process.env.TACTUS_DB_PORT ?? 3406);

async function freshDatabase(name: string) {
  const conn = await mariadb.createConnection({
    host: '127.0.0.1',
    port: dbPort,
    user: process.env.TACTUS_DB_USER ?? 'tactus',
    password: process.env.TACTUS_DB_PASSWORD ?? 'tactus-local',
  });
  await conn.query(`DROP DATABASE IF EXISTS ${name}`);
  await conn.query(`CREATE DATABASE ${name} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await conn.end();
}

async function startServer(name: string, db: string, env: Record<string, string> = {}) {
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  const log = path.join(work, `${name}.log`);
  const child = spawnTs(
    'server/index.ts',
    {
      ...JSON.parse(process.env.TACTUS_TEST_SERVER_ENV!),
      TACTUS_PORT: String(port),
      TACTUS_PUBLIC_URL: url,
      TACTUS_DB_NAME: db,
      TACTUS_STORAGE: 'disk',
      TACTUS_STORAGE_DIR: path.join(work, db, 'recordings'),
      TACTUS_SPOOL_DIR: path.join(work, db, 'spool'),
      TACTUS_SERVE_WEB: '0',
      TACTUS_ANALYSIS_WORKERS: '1',
      TACTUS_JOB_STALE_MS: '3000',
      ...env,
    },
    ['ignore', fs.openSync(log, 'w'), fs.openSync(log, 'a')],
  );
  children.push(child);
  await waitForOk(`${url}/api/health`, 60_000).catch(() => {
    throw new Error(`server ${name} did not start: ${fs.readFileSync(log, 'utf8')}`);
  });
  return { url, child };
}

async function player(url: string) {
  const email = uniqueEmail('faults');
  const a = agent(url);
  await a.post('/api/auth/sign-up/email').send({ name: 'Fault Finder', email, password: PASSWORD }).expect(200);
  await a.get(linkPath(await waitForMail(email, /confirm/i, 10_000, url), url)).expect(302);
  await a.post('/api/auth/sign-in/email').send({ email, password: PASSWORD }).expect(200);
  const songId = (await a.post('/api/songs').send({ title: 'Breakwater Air' }).expect(201)).body.id as string;
  return { a, songId };
}

/** The same signed-in person against another server process (sessions live in the database). */
function sameCookies(from: ReturnType<typeof agent>, url: string) {
  const b = agent(url);
  b.jar.setCookies(
    (from.jar.getCookies({ domain: '127.0.0.1', path: '/', secure: false, script: false }) as unknown as unknown[]).map(
      String,
    ),
  );
  return b;
}

async function until(check: () => Promise<boolean>, ms: number, what: string) {
  const end = Date.now() + ms;
  while (Date.now() < end) {
    if (await check().catch(() => false)) return;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`timed out waiting for ${what}`);
}

afterAll(() => {
  for (const c of children) c.kill('SIGKILL');
  fs.rmSync(work, { recursive: true, force: true });
});

test('kill -9 during uploads and analyses: every acknowledged upload survives and is analysed once', async () => {
  const DB = 'tactus_test_kill';
  await freshDatabase(DB);
  // Analyses slowed so that some are running when the process dies.
  const first = await startServer('kill-first', DB, { TACTUS_ANALYSIS_TEST_DELAY_MS: '1500' });
  const { a, songId } = await player(first.url);
  let acknowledged = 0;
  const uploads = Array.from({ length: 12 }, (_, i) =>
    a
      .post(`/api/songs/${songId}/recordings`)
      .field('kind', 'take')
      .attach('file', CLIP, `take-${i}.mp3`)
      .then(
        (res) => {
          if (res.status === 201) acknowledged++;
          return { status: res.status, id: res.body?.id as string | undefined };
        },
        () => ({ status: 0, id: undefined }), // cut off by the kill
      ),
  );
  await until(async () => acknowledged >= 4, 60_000, 'four uploads to be acknowledged');
  first.child.kill('SIGKILL');
  const answers = await Promise.all(uploads);
  const ids = answers.filter((u) => u.status === 201).map((u) => u.id!);
  expect(ids.length).toBeGreaterThanOrEqual(4);
  for (const u of answers) expect([0, 201]).toContain(u.status);

  const second = await startServer('kill-second', DB);
  const b = sameCookies(a, second.url);
  await until(
    async () => {
      const statuses = await Promise.all(ids.map(async (id) => (await b.get(`/api/recordings/${id}`)).body.status));
      return statuses.every((s) => s === 'done');
    },
    90_000,
    'every acknowledged upload to be analysed after the restart',
  );
  const rows = await query<{ id: string; storageKey: string }>(DB, 'SELECT id, storageKey FROM recordings');
  // Acknowledged means stored; an upload cut off may or may not have reached its row, never half of it.
  for (const id of ids) expect(rows.map((r) => r.id)).toContain(id);
  const dir = path.join(work, DB, 'recordings');
  for (const r of rows) expect(fs.existsSync(path.join(dir, String(r.storageKey)))).toBe(true);
  const jobs = await query<{ status: string }>(DB, 'SELECT status FROM analysis_jobs');
  expect(jobs).toHaveLength(rows.length);
  const analyses = await query<{ recordingId: string }>(DB, 'SELECT recordingId FROM analyses');
  expect(analyses).toHaveLength(new Set(analyses.map((x) => x.recordingId)).size);
  await until(
    async () =>
      (await query<{ status: string }>(DB, 'SELECT status FROM analysis_jobs')).every((j) => j.status === 'done'),
    60_000,
    'every job to finish',
  );
  console.log(
    `kill -9: ${ids.length} of 12 uploads acknowledged before the kill, ${rows.length} rows after the restart, all analysed once; ` +
      `${fs.readdirSync(dir).filter((f) => !rows.some((r) => r.storageKey === f)).length} object(s) without a row, for storage:check`,
  );
  second.child.kill('SIGTERM');
}, 200_000);

/** A TCP proxy to MariaDB that can be cut (every connection closed, new ones refused) and reopened. */
async function dbProxy() {
  const port = await freePort();
  const sockets = new Set<net.Socket>();
  let server: net.Server | null = null;
  const open = () =>
    new Promise<void>((resolve, reject) => {
      server = net.createServer((client) => {
        const upstream = net.connect(dbPort, '127.0.0.1');
        for (const s of [client, upstream]) {
          sockets.add(s);
          s.on('close', () => sockets.delete(s));
          s.on('error', () => {});
        }
        client.pipe(upstream).pipe(client);
      });
      server.once('error', reject);
      server.listen(port, '127.0.0.1', () => resolve());
    });
  const cut = () =>
    new Promise<void>((resolve) => {
      for (const s of sockets) s.destroy();
      server?.close(() => resolve());
    });
  await open();
  return { port, open, cut };
}

test('the database cut off mid-run: clear 503s, no crash, and recovery on its own', async () => {
  const DB = 'tactus_test_dbdown';
  await freshDatabase(DB);
  const proxy = await dbProxy();
  const server = await startServer('dbdown', DB, { TACTUS_DB_PORT: String(proxy.port) });
  const { a, songId } = await player(server.url);

  await proxy.cut();
  // Once the remembered session has lapsed (5 s), every request needs the database.
  await new Promise((r) => setTimeout(r, 5500));
  const health = await a.get('/api/health');
  expect(health.status).toBe(503);
  expect(health.body.database).toBe('down');
  const refusals = [
    await a.get('/api/songs'),
    await a.post('/api/songs').send({ title: 'Written while the database is away' }),
    await a.post(`/api/songs/${songId}/recordings`).field('kind', 'take').attach('file', CLIP, 'away.mp3'),
  ];
  for (const res of refusals) {
    expect(res.status).toBe(503);
    expect(res.body.error).toEqual({
      code: 'unavailable',
      message: expect.stringMatching(/database/),
      requestId: expect.any(String),
    });
  }
  expect(server.child.exitCode).toBeNull();
  const spool = path.join(work, DB, 'spool');
  expect(fs.existsSync(spool) ? fs.readdirSync(spool) : []).toEqual([]);

  await proxy.open();
  await until(async () => (await a.get('/api/health')).status === 200, 30_000, 'health to recover');
  const songs = (await a.get('/api/songs').expect(200)).body.songs;
  expect(songs.map((s: { title: string }) => s.title)).toEqual(['Breakwater Air']);
  const id = (
    await a.post(`/api/songs/${songId}/recordings`).field('kind', 'take').attach('file', CLIP, 'back.mp3').expect(201)
  ).body.id;
  await until(
    async () => (await a.get(`/api/recordings/${id}`)).body.status === 'done',
    60_000,
    'the analysis after recovery',
  );
  server.child.kill('SIGTERM');
  await proxy.cut();
}, 150_000);
