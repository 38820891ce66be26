// Fifty players at once, on the shared test server (files on disk): each signs up, uploads a take, polls
// until its analysis is done and fetches everything back. Every upload the server acknowledged (2xx) must be
// stored, analysed, readable byte for byte, with its tempo where the clip's tempo map puts it; no file is left
// without a row and no row without its file. Counts and times are printed, never asserted. The clips and
// their truth come from fixtures/generate.ts --clips (tempo known by construction).
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { accuracy1 } from '@/audio/analysis/evaluation';
import { query, servers, signedInUser } from './helpers';
import { root } from '@/tests/setup/processes';

const PLAYERS = 50;
const CLIPS = ['waltz-150', 'drums-bass-124', 'fingerpicked-guitar-88'];
const clip = (name: string) => fs.readFileSync(path.join(root, `fixtures/clips/${name}.mp3`));
const truthBpm = (name: string) =>
  (JSON.parse(fs.readFileSync(path.join(root, `fixtures/clips/${name}.truth.json`), 'utf8')) as { bpm: number }).bpm;
const sha = (b: Buffer) => crypto.createHash('sha256').update(b).digest('hex');

async function inBatches<T, R>(items: T[], width: number, run: (item: T, i: number) => Promise<R>): Promise<R[]> {
  const out: R[] = [];
  for (let i = 0; i < items.length; i += width)
    out.push(...(await Promise.all(items.slice(i, i + width).map((item, j) => run(item, i + j)))));
  return out;
}

test(`${PLAYERS} players upload, wait for their analyses and read them back`, async () => {
  const started = performance.now();
  const players = await inBatches(Array.from({ length: PLAYERS }), 10, (_, i) => signedInUser(`load-${i}`));
  const signedUp = performance.now();

  // All uploads at once.
  const uploads = await Promise.all(
    players.map(async (p, i) => {
      const name = CLIPS[i % CLIPS.length]!;
      const song = (
        await p.agent
          .post('/api/songs')
          .send({ title: `Load piece ${i}` })
          .expect(201)
      ).body.id as string;
      const res = await p.agent
        .post(`/api/songs/${song}/recordings`)
        .field('kind', 'take')
        .attach('file', clip(name), `${name}.mp3`);
      return { p, name, song, status: res.status, id: res.body.id as string | undefined };
    }),
  );
  const uploaded = performance.now();
  const acknowledged = uploads.filter((u) => u.status >= 200 && u.status < 300);
  // Anything not acknowledged must be a clear refusal (busy), never a server error.
  for (const u of uploads) expect(u.status === 201 || u.status === 503).toBe(true);

  // Poll every acknowledged upload to the end of its analysis.
  const deadline = Date.now() + 150_000;
  const finished = await Promise.all(
    acknowledged.map(async (u) => {
      for (;;) {
        const r = (await u.p.agent.get(`/api/recordings/${u.id}`).expect(200)).body;
        if (r.status === 'done' || r.status === 'failed') return { ...u, recording: r };
        if (Date.now() > deadline) throw new Error(`analysis of ${u.id} still ${r.status}`);
        await new Promise((res) => setTimeout(res, 500));
      }
    }),
  );
  const analysed = performance.now();

  for (const f of finished) {
    expect(f.recording.status).toBe('done');
    // The tempo within 4 % of the clip's notated tempo (Accuracy1, Gouyon et al. 2006).
    expect(accuracy1(f.recording.analysis.bpm, truthBpm(f.name))).toBe(true);
    const audio = await f.p.agent.get(`/api/recordings/${f.id}/audio`).buffer(true).expect(200);
    expect(sha(audio.body as Buffer)).toBe(sha(clip(f.name)));
    await f.p.agent.get(`/api/recordings/${f.id}/peaks`).expect(200);
    const list = (await f.p.agent.get(`/api/songs/${f.song}/recordings`).expect(200)).body.recordings;
    expect(list.map((r: { id: string }) => r.id)).toEqual([f.id]);
  }

  // Each acknowledged upload has one row, one finished job and its file; nothing else was stored for them.
  const ids = acknowledged.map((u) => u.id!);
  const rows = await query<{ id: string; storageKey: string; status: string }>(
    servers.disk.db,
    `SELECT r.id, r.storageKey, j.status FROM recordings r JOIN analysis_jobs j ON j.recordingId = r.id WHERE r.id IN (${ids.map(() => '?').join(',')})`,
    ids,
  );
  expect(rows).toHaveLength(ids.length);
  for (const r of rows) {
    expect(r.status).toBe('done');
    expect(fs.existsSync(path.join(process.env.TACTUS_TEST_DISK_DIR!, String(r.storageKey)))).toBe(true);
  }
  const songsOfPlayers = uploads.map((u) => u.song);
  const allRows = await query<{ n: bigint }>(
    servers.disk.db,
    `SELECT COUNT(*) AS n FROM recordings WHERE songId IN (${songsOfPlayers.map(() => '?').join(',')})`,
    songsOfPlayers,
  );
  expect(Number(allRows[0]!.n)).toBe(ids.length);

  const s = (a: number, b: number) => ((b - a) / 1000).toFixed(1);
  console.log(
    `${PLAYERS} players: signed up in ${s(started, signedUp)} s, ${acknowledged.length} uploads acknowledged in ${s(signedUp, uploaded)} s, all analysed ${s(uploaded, analysed)} s later, read back in ${s(analysed, performance.now())} s`,
  );
}, 240_000);
