// A storage folder that fills up: a 2 MB tmpfs mounted for the test (where the machine allows mounting; the
// test is skipped with the reason otherwise) holds the store of a server of its own. Uploads are accepted
// while they fit, then refused with a 507 in plain words; nothing half-written is left and every row has its
// whole file (507 Insufficient Storage, RFC 4918 §11.5).
import { execFileSync, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import mariadb from 'mariadb';
import { agent, linkPath, PASSWORD, query, uniqueEmail, waitForMail } from './helpers';
import { freePort, root, spawnTs, waitForOk } from '@/tests/setup/processes';

const DB = 'tactus_test_full';
const CLIP = fs.readFileSync(path.join(root, 'fixtures/clips/waltz-150.mp3'));
const work = fs.mkdtempSync(path.join(os.tmpdir(), 'tactus-full-'));
const store = path.join(work, 'store');
fs.mkdirSync(store);

function mountSmallDisk(): string | null {
  try {
    execFileSync('mount', ['-t', 'tmpfs', '-o', 'size=2m', 'tmpfs', store], { stdio: 'pipe' });
    return null;
  } catch (err) {
    return `cannot mount a small tmpfs here (${String((err as Error).message).split('\n')[0]})`;
  }
}
const cannotMount = mountSmallDisk();
if (cannotMount) console.log(`storage-full test skipped: ${cannotMount}`);

let child: ChildProcess | null = null;
afterAll(() => {
  child?.kill('SIGKILL');
  if (!cannotMount) execFileSync('umount', ['-l', store]);
  fs.rmSync(work, { recursive: true, force: true });
});

(cannotMount ? test.skip : test)(
  'a full storage folder: uploads refused with a clear 507, nothing half-written',
  async () => {
    const conn = await mariadb.createConnection({
      host: '127.0.0.1',
      port: Number(process.env.TACTUS_DB_PORT ?? 3406),
      user: process.env.TACTUS_DB_USER ?? 'tactus',
      password: process.env.TACTUS_DB_PASSWORD ?? 'tactus-local',
    });
    await conn.query(`DROP DATABASE IF EXISTS ${DB}`);
    await conn.query(`CREATE DATABASE ${DB} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
    await conn.end();
    const port = await freePort();
    const url = `http://127.0.0.1:${port}`;
    const log = path.join(work, 'server.log');
    child = spawnTs(
      'server/index.ts',
      {
        ...JSON.parse(process.env.TACTUS_TEST_SERVER_ENV!),
        TACTUS_PORT: String(port),
        TACTUS_PUBLIC_URL: url,
        TACTUS_DB_NAME: DB,
        TACTUS_STORAGE: 'disk',
        TACTUS_STORAGE_DIR: store,
        TACTUS_SPOOL_DIR: path.join(work, 'spool'),
        TACTUS_SERVE_WEB: '0',
      },
      ['ignore', fs.openSync(log, 'w'), fs.openSync(log, 'a')],
    );
    await waitForOk(`${url}/api/health`, 60_000);
    const email = uniqueEmail('full');
    const a = agent(url);
    await a.post('/api/auth/sign-up/email').send({ name: 'Full Disk', email, password: PASSWORD }).expect(200);
    await a.get(linkPath(await waitForMail(email, /confirm/i, 10_000, url), url)).expect(302);
    await a.post('/api/auth/sign-in/email').send({ email, password: PASSWORD }).expect(200);
    const songId = (await a.post('/api/songs').send({ title: 'Tide Table Polka' }).expect(201)).body.id;

    // 2 MB holds eight copies of the 242 kB clip; the twelfth cannot fit.
    const statuses: number[] = [];
    for (let i = 0; i < 12; i++) {
      const res = await a
        .post(`/api/songs/${songId}/recordings`)
        .field('kind', 'take')
        .attach('file', CLIP, `t${i}.mp3`);
      statuses.push(res.status);
      if (res.status !== 201) {
        expect(res.status).toBe(507);
        expect(res.body.error).toEqual({
          code: 'storage_full',
          message: expect.stringMatching(/storage space/),
          field: 'file',
          requestId: expect.any(String),
        });
      }
    }
    const stored = statuses.filter((s) => s === 201).length;
    expect(stored).toBeGreaterThan(0);
    expect(statuses.filter((s) => s === 507).length).toBeGreaterThan(0);
    expect(child.exitCode).toBeNull();
    // Nothing half-written: no cut-off write, every row with its whole file, no file without a row.
    const rows = await query<{ storageKey: string }>(DB, 'SELECT storageKey FROM recordings');
    expect(rows).toHaveLength(stored);
    expect(fs.readdirSync(store).sort()).toEqual(rows.map((r) => String(r.storageKey)).sort());
    for (const r of rows) expect(fs.statSync(path.join(store, String(r.storageKey))).size).toBe(CLIP.length);
    console.log(`storage full: ${stored} uploads stored, then ${statuses.length - stored} refused with 507`);
  },
  90_000,
);
