// Analysis jobs across processes: several servers on one database each take jobs, every job is done exactly
// once, and a job whose server is killed mid-way is finished by the next server that starts.
import type { ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import mariadb from 'mariadb';
import { agent, linkPath, PASSWORD, query, uniqueEmail, waitForMail } from './helpers';
import { freePort, root, spawnTs, waitForOk } from '@/tests/setup/processes';

const DB = 'tactus_test_jobs';
const CLIP = fs.readFileSync(path.join(root, 'fixtures/clips/waltz-150.mp3'));
const work = fs.mkdtempSync(path.join(os.tmpdir(), 'tactus-jobs-'));
const children: ChildProcess[] = [];

/** A server process of its own on the jobs database; analysis is slowed so a job is caught running. */
async function startServer(name: string) {
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  const env = {
    ...JSON.parse(process.env.TACTUS_TEST_SERVER_ENV!),
    TACTUS_PORT: String(port),
    TACTUS_PUBLIC_URL: url,
    TACTUS_DB_NAME: DB,
    TACTUS_STORAGE: 'disk',
    TACTUS_STORAGE_DIR: path.join(work, 'recordings'),
    TACTUS_SPOOL_DIR: path.join(work, `spool-${name}`),
    TACTUS_SERVE_WEB: '0',
    TACTUS_ANALYSIS_WORKERS: '1',
    TACTUS_ANALYSIS_TEST_DELAY_MS: '2500',
    TACTUS_JOB_STALE_MS: '3000',
  };
  const log = fs.openSync(path.join(work, `${name}.log`), 'w');
  // spawnTs runs node itself, so that SIGKILL really kills the server.
  const child = spawnTs('server/index.ts', env, ['ignore', log, log]);
  children.push(child);
  await waitForOk(`${url}/api/health`, 60_000).catch(() => {
    throw new Error(`server ${name} did not start: ${fs.readFileSync(path.join(work, `${name}.log`), 'utf8')}`);
  });
  return { url, child };
}

async function playerWithSong(url: string) {
  const email = uniqueEmail('jobs');
  const a = agent(url);
  await a.post('/api/auth/sign-up/email').send({ name: 'Job Runner', email, password: PASSWORD }).expect(200);
  await a.get(linkPath(await waitForMail(email, /confirm/i, 10_000, url), url)).expect(302);
  await a.post('/api/auth/sign-in/email').send({ email, password: PASSWORD }).expect(200);
  const songId = (await a.post('/api/songs').send({ title: 'Copperline Reel' }).expect(201)).body.id as string;
  return { a, songId };
}

async function statusOf(a: ReturnType<typeof agent>, id: string) {
  return (await a.get(`/api/recordings/${id}`).expect(200)).body.status as string;
}

async function until(check: () => Promise<boolean>, ms: number, what: string) {
  const end = Date.now() + ms;
  while (Date.now() < end) {
    if (await check()) return;
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error(`timed out waiting for ${what}`);
}

beforeAll(async () => {
  const conn = await mariadb.createConnection({
    host: '127.0.0.1',
    port: Number(process.env.TACTUS_DB_PORT ?? 3406),
    user: process.env.TACTUS_DB_USER ?? 'tactus',
    password: process.env.TACTUS_DB_PASSWORD ?? 'tactus-local',
  });
  await conn.query(`DROP DATABASE IF EXISTS ${DB}`);
  await conn.query(`CREATE DATABASE ${DB} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await conn.end();
});

afterAll(() => {
  for (const c of children) c.kill('SIGKILL');
});

test('a server killed while a job runs: the next server finishes it, with one result', async () => {
  const first = await startServer('first');
  const { a, songId } = await playerWithSong(first.url);
  const id = (
    await a.post(`/api/songs/${songId}/recordings`).field('kind', 'take').attach('file', CLIP, 'take.mp3').expect(201)
  ).body.id;
  await until(async () => (await statusOf(a, id)) === 'running', 20_000, 'the job to start');
  first.child.kill('SIGKILL');
  await new Promise((r) => first.child.once('exit', r));

  const second = await startServer('second');
  // The session lives in the database, so the same cookie works against the new process.
  const b = agent(second.url);
  b.jar.setCookies(
    (a.jar.getCookies({ domain: '127.0.0.1', path: '/', secure: false, script: false }) as unknown as unknown[]).map(
      String,
    ),
  );
  await until(async () => (await statusOf(b, id)) === 'done', 40_000, 'the job to finish after the restart');
  const [job] = await query<{ status: string; attempts: number; finishedBy: string }>(
    DB,
    'SELECT status, attempts, finishedBy FROM analysis_jobs WHERE recordingId = ?',
    [id],
  );
  expect(job!.status).toBe('done');
  expect(job!.attempts).toBe(2);
  expect(await query(DB, 'SELECT recordingId FROM analyses WHERE recordingId = ?', [id])).toHaveLength(1);
  second.child.kill('SIGTERM');
}, 120_000);

test('two server processes on one database share the queue and do each job exactly once', async () => {
  // Both serve the same queue; requests go to the first.
  const [one] = await Promise.all([startServer('one'), startServer('two')]);
  const { a, songId } = await playerWithSong(one.url);
  const ids: string[] = [];
  for (let i = 0; i < 6; i++) {
    ids.push(
      (
        await a
          .post(`/api/songs/${songId}/recordings`)
          .field('kind', 'take')
          .attach('file', CLIP, `take-${i}.mp3`)
          .expect(201)
      ).body.id,
    );
  }
  await until(
    async () => (await Promise.all(ids.map((id) => statusOf(a, id)))).every((s) => s === 'done'),
    60_000,
    'all six analyses',
  );
  const jobs = await query<{ attempts: number; finishedBy: string }>(
    DB,
    `SELECT attempts, finishedBy FROM analysis_jobs WHERE recordingId IN (${ids.map(() => '?').join(',')})`,
    ids,
  );
  expect(jobs).toHaveLength(6);
  for (const j of jobs) expect(j.attempts).toBe(1);
  // Both processes took work (each has one worker and every job takes over 2.5 s).
  expect(new Set(jobs.map((j) => j.finishedBy)).size).toBe(2);
  const results = await query<{ n: bigint }>(
    DB,
    `SELECT COUNT(*) AS n FROM analyses WHERE recordingId IN (${ids.map(() => '?').join(',')})`,
    ids,
  );
  expect(Number(results[0]!.n)).toBe(6);
}, 150_000);
