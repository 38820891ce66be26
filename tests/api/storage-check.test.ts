// npm run storage:check on both drivers: objects no row names and rows whose object is gone are listed, and
// --fix removes only orphaned objects older than the limit. The command runs against the test databases but
// a store of its own (a folder, a bucket), so the shared test servers' files are never touched.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { PutObjectCommand, S3Client, CreateBucketCommand, HeadObjectCommand } from '@aws-sdk/client-s3';
import { query, servers, signedInUser, type TestServer } from './helpers';
import { root } from '@/tests/setup/processes';

const CLIP = fs.readFileSync(path.join(root, 'fixtures/clips/waltz-150.mp3'));
const work = fs.mkdtempSync(path.join(os.tmpdir(), 'tactus-storage-check-'));
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));

const baseEnv = JSON.parse(process.env.TACTUS_TEST_SERVER_ENV!) as NodeJS.ProcessEnv;
const s3 = new S3Client({
  endpoint: process.env.TACTUS_TEST_S3_ENDPOINT,
  region: 'us-east-1',
  forcePathStyle: true,
  credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
});
const BUCKET = 'tactus-storage-check';

interface Report {
  objects: number;
  rows: number;
  orphanObjects: { key: string; removed: boolean }[];
  missingObjects: { recordingId: string; storageKey: string }[];
}

function storageCheck(env: NodeJS.ProcessEnv, ...args: string[]): { report: Report; code: number | null } {
  const run = spawnSync(
    process.execPath,
    ['--import', 'tsx', path.join(root, 'server/scripts/storage-check.ts'), '--json', ...args],
    { env, cwd: root, encoding: 'utf8' },
  );
  if (run.status === 2) throw new Error(run.stderr);
  return { report: JSON.parse(run.stdout.trim().split('\n').pop()!) as Report, code: run.status };
}

/** A recording uploaded through the API on `server`; its row and storage key. */
async function uploaded(server: TestServer) {
  const p = await signedInUser('storage-check', 'player', server);
  const song = (await p.agent.post('/api/songs').send({ title: 'Pier Street Jig' }).expect(201)).body.id;
  const id = (
    await p.agent
      .post(`/api/songs/${song}/recordings`)
      .field('kind', 'take')
      .attach('file', CLIP, 'jig.mp3')
      .expect(201)
  ).body.id as string;
  const [row] = await query<{ storageKey: string }>(server.db, 'SELECT storageKey FROM recordings WHERE id = ?', [id]);
  return { id, key: String(row!.storageKey) };
}

test('disk: orphans listed both ways; --fix removes the hour-old orphan and a cut-off write, keeps a young one', async () => {
  const dir = path.join(work, 'disk');
  fs.mkdirSync(dir);
  const env = { ...baseEnv, TACTUS_STORAGE: 'disk', TACTUS_STORAGE_DIR: dir, TACTUS_DB_NAME: servers.disk.db };
  const kept = await uploaded(servers.disk);
  const gone = await uploaded(servers.disk);
  // The folder holds the first recording's object, not the second's, and three objects no row names.
  fs.writeFileSync(path.join(dir, kept.key), CLIP);
  const twoHoursAgo = new Date(Date.now() - 2 * 3600_000);
  const old = '0b1d0000-0000-4000-8000-000000000001';
  const young = '0b1d0000-0000-4000-8000-000000000002';
  const incoming = '.incoming-00112233445566ff';
  for (const name of [old, young, incoming]) fs.writeFileSync(path.join(dir, name), 'x');
  for (const name of [old, incoming]) fs.utimesSync(path.join(dir, name), twoHoursAgo, twoHoursAgo);

  const before = storageCheck(env);
  expect(before.code).toBe(1); // rows whose object is missing
  expect(before.report.orphanObjects.map((o) => o.key).sort()).toEqual([incoming, old, young].sort());
  expect(before.report.orphanObjects.every((o) => !o.removed)).toBe(true);
  const missing = before.report.missingObjects.map((m) => m.recordingId);
  expect(missing).toContain(gone.id);
  expect(missing).not.toContain(kept.id);
  expect(fs.readdirSync(dir)).toHaveLength(4);

  const fixed = storageCheck(env, '--fix');
  expect(
    fixed.report.orphanObjects
      .filter((o) => o.removed)
      .map((o) => o.key)
      .sort(),
  ).toEqual([incoming, old].sort());
  expect(fs.readdirSync(dir).sort()).toEqual([kept.key, young].sort());
  // Rows are never removed by the check.
  expect(await query(servers.disk.db, 'SELECT id FROM recordings WHERE id = ?', [gone.id])).toHaveLength(1);
}, 60_000);

test('S3: orphans listed both ways; --fix with an age of 0 removes the orphan and keeps the named object', async () => {
  await s3.send(new CreateBucketCommand({ Bucket: BUCKET })).catch(() => {});
  const env = {
    ...baseEnv,
    TACTUS_STORAGE: 's3',
    TACTUS_S3_ENDPOINT: process.env.TACTUS_TEST_S3_ENDPOINT,
    TACTUS_S3_BUCKET: BUCKET,
    TACTUS_DB_NAME: servers.s3.db,
  };
  const kept = await uploaded(servers.s3);
  const gone = await uploaded(servers.s3);
  const orphan = '0b1d0000-0000-4000-8000-000000000003';
  await s3.send(new PutObjectCommand({ Bucket: BUCKET, Key: kept.key, Body: CLIP }));
  await s3.send(new PutObjectCommand({ Bucket: BUCKET, Key: orphan, Body: 'x' }));

  const before = storageCheck(env);
  expect(before.report.orphanObjects.map((o) => o.key)).toEqual([orphan]);
  expect(before.report.missingObjects.map((m) => m.recordingId)).toContain(gone.id);
  expect(before.report.missingObjects.map((m) => m.recordingId)).not.toContain(kept.id);

  // Just written: an hour's limit keeps it.
  expect(storageCheck(env, '--fix').report.orphanObjects).toEqual([
    expect.objectContaining({ key: orphan, removed: false }),
  ]);
  const fixed = storageCheck(env, '--fix', '--older-than-minutes=0');
  expect(fixed.report.orphanObjects).toEqual([expect.objectContaining({ key: orphan, removed: true })]);
  await expect(s3.send(new HeadObjectCommand({ Bucket: BUCKET, Key: orphan }))).rejects.toBeTruthy();
  await s3.send(new HeadObjectCommand({ Bucket: BUCKET, Key: kept.key }));
}, 60_000);
