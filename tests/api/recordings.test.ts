// Uploads, analysis, ranges, ownership and hostile inputs, against the real server and MariaDB with both
// storage drivers (local disk, and S3 through the fake S3 server). Fixtures are the committed clips (truth
// from their tempo maps) and damaged copies of them made here.
import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import request from 'supertest';
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import { accuracy1 } from '@/audio/analysis/evaluation';
import { query, servers, signedInUser, smallUpload, waitForAnalysis, type TestServer } from './helpers';

const CLIPS = path.resolve(__dirname, '../../fixtures/clips');
const clip = (name: string) => fs.readFileSync(path.join(CLIPS, name));

const s3 = new S3Client({
  endpoint: process.env.TACTUS_TEST_S3_ENDPOINT,
  region: 'us-east-1',
  forcePathStyle: true,
  credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
});

/** Every stored file of a server: files in its folder, or objects in its bucket. */
async function storedFiles(server: TestServer): Promise<string[]> {
  if (server.name === 'disk') {
    const dir = process.env.TACTUS_TEST_DISK_DIR!;
    return fs.existsSync(dir) ? fs.readdirSync(dir) : [];
  }
  const res = await s3
    .send(new ListObjectsV2Command({ Bucket: process.env.TACTUS_TEST_S3_BUCKET! }))
    .catch(() => ({ Contents: [] }));
  return (res.Contents ?? []).map((o) => o.Key!);
}
const spoolFiles = (server: TestServer) => (fs.existsSync(server.spool) ? fs.readdirSync(server.spool) : []);
/** Stored files that no recording row names (a file left behind). */
async function orphanFiles(server: TestServer): Promise<string[]> {
  const keys = new Set(
    (await query<{ storageKey: string }>(server.db, 'SELECT storageKey FROM recordings')).map((r) =>
      String(r.storageKey),
    ),
  );
  return (await storedFiles(server)).filter((f) => !keys.has(f));
}

/**
 * Waits until `read` gives an empty list. Other test files upload to the same server at the same time, and
 * their uploads pass through the spool and the store for a moment: what is left for good stays, what is in
 * flight goes.
 */
async function eventuallyEmpty(read: () => Promise<string[]> | string[], timeoutMs = 15_000): Promise<string[]> {
  const until = Date.now() + timeoutMs;
  let left = await read();
  while (left.length > 0 && Date.now() < until) {
    await new Promise((r) => setTimeout(r, 100));
    left = await read();
  }
  return left;
}
const rowsFor = async (server: TestServer, songId: string) =>
  Number(
    (await query<{ n: bigint }>(server.db, 'SELECT COUNT(*) AS n FROM recordings WHERE songId = ?', [songId]))[0]!.n,
  );

describe.each([servers.disk, servers.s3])('recordings stored on $name', (server) => {
  let owner: Awaited<ReturnType<typeof signedInUser>>;
  let songId: string;

  beforeAll(async () => {
    owner = await signedInUser(`rec-${server.name}`, 'player', server);
    songId = (
      await owner.agent.post('/api/songs').send({ title: 'Nine Steps Waltz', meter: '3/4', goalBpm: 152 }).expect(201)
    ).body.id;
  });

  const upload = (file: Buffer, name: string, kind = 'take', label?: string) => {
    // Built by hand when the name needs to reach the server as it is (form-data would shorten '../x' to 'x').
    if (/[\\/\u0000-\u001f]/.test(name)) {
      const boundary = `----tactus${crypto.randomBytes(8).toString('hex')}`;
      const body = Buffer.concat([
        Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="kind"\r\n\r\n${kind}\r\n`),
        Buffer.from(
          `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${name}"\r\nContent-Type: application/octet-stream\r\n\r\n`,
          'latin1',
        ),
        file,
        Buffer.from(`\r\n--${boundary}--\r\n`),
      ]);
      return owner.agent
        .post(`/api/songs/${songId}/recordings`)
        .set('Content-Type', `multipart/form-data; boundary=${boundary}`)
        .send(body);
    }
    const req = owner.agent.post(`/api/songs/${songId}/recordings`).field('kind', kind);
    if (label) req.field('label', label);
    return req.attach('file', file, { filename: name, contentType: 'application/octet-stream' });
  };

  test.each([
    ['wav', 'audio/wav'],
    ['mp3', 'audio/mpeg'],
    ['ogg', 'audio/ogg'],
    ['flac', 'audio/flac'],
    ['m4a', 'audio/mp4'],
  ])('a %s upload is stored, analysed and served back as %s', async (format, mime) => {
    const bytes = clip(`waltz-150.${format}`);
    const res = await upload(bytes, `waltz.${format}`, 'reference', `Waltz (${format})`).expect(201);
    expect(res.body).toMatchObject({
      kind: 'reference',
      label: `Waltz (${format})`,
      format,
      sizeBytes: bytes.length,
      status: expect.stringMatching(/queued|running|done/),
    });
    const done = await waitForAnalysis(owner.agent, res.body.id);
    expect(done.status).toBe('done');
    // Truth: the clip's tempo map (fixtures/pieces.ts) — 150 BPM in 3/4.
    expect(accuracy1(done.analysis.bpm, 150)).toBe(true);
    expect(done.analysis.meter).toBe('3/4');
    const audio = await owner.agent
      .get(`/api/recordings/${res.body.id}/audio`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(audio.status).toBe(200);
    expect(audio.headers['content-type']).toContain(mime);
    expect(Buffer.compare(audio.body as Buffer, bytes)).toBe(0);
    const peaks = (await owner.agent.get(`/api/recordings/${res.body.id}/peaks`).expect(200)).body;
    expect(peaks.minMax.length).toBe(2 * peaks.buckets);
  });

  describe('HTTP ranges', () => {
    let id: string;
    let bytes: Buffer;
    beforeAll(async () => {
      bytes = clip('drums-bass-124.mp3');
      id = (await upload(bytes, 'groove.mp3').expect(201)).body.id;
    });
    const get = (range: string) =>
      owner.agent
        .get(`/api/recordings/${id}/audio`)
        .set('Range', range)
        .buffer(true)
        .parse((r, cb) => {
          const chunks: Buffer[] = [];
          r.on('data', (c: Buffer) => chunks.push(c));
          r.on('end', () => cb(null, Buffer.concat(chunks)));
        });

    test('the first bytes', async () => {
      const res = await get('bytes=0-99');
      expect(res.status).toBe(206);
      expect(res.headers['content-range']).toBe(`bytes 0-99/${bytes.length}`);
      expect(Buffer.compare(res.body, bytes.subarray(0, 100))).toBe(0);
    });
    test('a middle slice', async () => {
      const res = await get('bytes=1000-1999');
      expect(res.status).toBe(206);
      expect(Buffer.compare(res.body, bytes.subarray(1000, 2000))).toBe(0);
    });
    test('a suffix', async () => {
      const res = await get('bytes=-500');
      expect(res.status).toBe(206);
      expect(res.headers['content-range']).toBe(`bytes ${bytes.length - 500}-${bytes.length - 1}/${bytes.length}`);
      expect(Buffer.compare(res.body, bytes.subarray(bytes.length - 500))).toBe(0);
    });
    test('a range past the end is 416', async () => {
      const res = await get(`bytes=${bytes.length + 10}-`);
      expect(res.status).toBe(416);
      expect(res.headers['content-range']).toBe(`bytes */${bytes.length}`);
    });
  });

  test('another player gets 404 for the recording and its audio; anonymous gets 401', async () => {
    const id = (await upload(clip('fingerpicked-guitar-88.ogg'), 'guitar.ogg').expect(201)).body.id;
    const stranger = await signedInUser(`stranger-${server.name}`, 'player', server);
    await stranger.agent.get(`/api/recordings/${id}`).expect(404);
    await stranger.agent.get(`/api/recordings/${id}/audio`).expect(404);
    await stranger.agent.delete(`/api/recordings/${id}`).expect(404);
    await stranger.agent
      .post(`/api/songs/${songId}/recordings`)
      .field('kind', 'take')
      .attach('file', smallUpload, 'w.wav')
      .expect(404);
    await request(server.url).get(`/api/recordings/${id}`).expect(401);
    await request(server.url).get(`/api/recordings/${id}/audio`).expect(401);
  });

  test('the player corrects the tempo and the beat offset; bad values are refused', async () => {
    const id = (await upload(clip('waltz-150.flac'), 'w.flac').expect(201)).body.id;
    await waitForAnalysis(owner.agent, id);
    const patched = await owner.agent
      .patch(`/api/recordings/${id}`)
      .send({ correctedBpm: 75, beatOffsetSec: 0.12, label: 'half-time feel' })
      .expect(200);
    expect(patched.body).toMatchObject({
      correctedBpm: 75,
      originalBpm: 75,
      beatOffsetSec: 0.12,
      label: 'half-time feel',
    });
    const bad = await owner.agent.patch(`/api/recordings/${id}`).send({ correctedBpm: 900 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('correctedBpm');
    const undone = await owner.agent.patch(`/api/recordings/${id}`).send({ correctedBpm: null }).expect(200);
    expect(undone.body.originalBpm).toBeCloseTo(150, 0);
  });

  test('a failed analysis can be retried, and then completes', async () => {
    const id = (await upload(clip('waltz-150.wav'), 'w.wav').expect(201)).body.id;
    await waitForAnalysis(owner.agent, id);
    await owner.agent.post(`/api/recordings/${id}/retry`).expect(409);
    // Fail it as a worker would have (the engine does not fail on a valid file).
    await query(server.db, "UPDATE analysis_jobs SET status = 'failed', lastError = 'test' WHERE recordingId = ?", [
      id,
    ]);
    await query(server.db, "UPDATE recordings SET status = 'failed', error = 'analysis failed: test' WHERE id = ?", [
      id,
    ]);
    expect((await owner.agent.get(`/api/recordings/${id}`)).body).toMatchObject({
      status: 'failed',
      error: 'analysis failed: test',
    });
    await owner.agent.post(`/api/recordings/${id}/retry`).expect(202);
    const again = await waitForAnalysis(owner.agent, id);
    expect(again.status).toBe('done');
    expect(again.error).toBeNull();
  });

  const keyOf = async (id: string) =>
    String(
      (await query<{ storageKey: string }>(server.db, 'SELECT storageKey FROM recordings WHERE id = ?', [id]))[0]!
        .storageKey,
    );

  test('deleting a recording removes its file and rows', async () => {
    const id = (await upload(clip('waltz-150.ogg'), 'w.ogg').expect(201)).body.id;
    const key = await keyOf(id);
    expect(await storedFiles(server)).toContain(key);
    await waitForAnalysis(owner.agent, id);
    await owner.agent.delete(`/api/recordings/${id}`).expect(204);
    await owner.agent.get(`/api/recordings/${id}`).expect(404);
    expect(await storedFiles(server)).not.toContain(key);
    expect(await query(server.db, 'SELECT 1 FROM analyses WHERE recordingId = ?', [id])).toHaveLength(0);
  });

  test('deleting a song removes its recordings, their files and every row that hangs from it', async () => {
    const other = (await owner.agent.post('/api/songs').send({ title: 'Short-lived' }).expect(201)).body.id;
    const keys: string[] = [];
    const ids: string[] = [];
    for (const f of ['waltz-150.mp3', 'waltz-150.wav']) {
      const id = (
        await owner.agent
          .post(`/api/songs/${other}/recordings`)
          .field('kind', 'take')
          .attach('file', clip(f), f)
          .expect(201)
      ).body.id;
      ids.push(id);
      keys.push(await keyOf(id));
    }
    await waitForAnalysis(owner.agent, ids[0]!);
    await owner.agent.post(`/api/songs/${other}/candidates`).send({ bpm: 150 }).expect(201);
    await owner.agent
      .post(`/api/songs/${other}/passages`)
      .send({ recordingId: ids[0], name: 'first bars', startSec: 0, endSec: 2 })
      .expect(201);
    await owner.agent
      .post(`/api/songs/${other}/practice`)
      .send({
        recordingId: ids[0],
        startSec: 0,
        endSec: 2,
        startBpm: 140,
        reachedBpm: 150,
        repetitions: 3,
        minutes: 5,
        clean: true,
      })
      .expect(201);
    expect(await storedFiles(server)).toEqual(expect.arrayContaining(keys));
    await owner.agent.delete(`/api/songs/${other}`).expect(204);
    expect(await rowsFor(server, other)).toBe(0);
    for (const table of ['candidate_tempos', 'passages', 'practice_entries']) {
      expect(await query(server.db, `SELECT 1 FROM ${table} WHERE songId = ?`, [other])).toHaveLength(0);
    }
    for (const table of ['analyses', 'analysis_jobs']) {
      expect(await query(server.db, `SELECT 1 FROM ${table} WHERE recordingId IN (?, ?)`, ids)).toHaveLength(0);
    }
    const left = await storedFiles(server);
    expect(keys.filter((k) => left.includes(k))).toEqual([]);
  });

  describe('hostile uploads: a clear 4xx, and no row, no file, no temporary file left', () => {
    const wav = clip('waltz-150.wav');
    const mp3 = clip('waltz-150.mp3');
    // A WAV whose header still promises 12 s of data, cut to a third of that.
    const shortWav = wav.subarray(0, 44 + Math.floor((wav.length - 44) / 3));
    const oversize = Buffer.concat([
      wav,
      Buffer.alloc(Number(process.env.TACTUS_TEST_MAX_UPLOAD) + 1024 * 1024 - wav.length),
    ]);
    const cases: [string, () => Buffer, string, string, number[]][] = [
      ['a zero-length file', () => Buffer.alloc(0), 'empty.mp3', 'take', [400]],
      ['a truncated MP3', () => mp3.subarray(0, Math.floor(mp3.length * 0.4)), 'cut.mp3', 'take', [400]],
      [
        'a PNG renamed .mp3',
        () => fs.readFileSync(path.resolve(__dirname, '../../assets/favicon.png')),
        'cover.mp3',
        'take',
        [415],
      ],
      ['random bytes', () => crypto.randomBytes(200_000), 'noise.wav', 'take', [415]],
      ['a WAV whose header claims more data than it has', () => shortWav, 'short.wav', 'take', [400]],
      ['an oversize file', () => oversize, 'huge.wav', 'take', [413]],
      ['a file name with ../ in it', () => mp3, '../../etc/take.mp3', 'take', [400]],
      ['a file name with control characters', () => mp3, 'take\u0007\u001b[2J\u0001.mp3', 'take', [400]],
      ['a wrong kind', () => mp3, 'take.mp3', 'rehearsal', [400]],
    ];
    test.each(cases)('%s', async (_label, make, name, kind, statuses) => {
      const rowsBefore = await rowsFor(server, songId);
      let res;
      try {
        res = await upload(make(), name, kind);
      } catch (err) {
        // The server may close the connection on an oversize body before the client has sent it all.
        if (!/EPIPE|ECONNRESET/.test(String((err as Error).message))) throw err;
        res = null;
      }
      if (res) {
        expect(statuses).toContain(res.status);
        expect(res.body.error.message.length).toBeGreaterThan(10);
        expect(res.body.error.field).toMatch(/file|kind/);
      }
      expect(await rowsFor(server, songId)).toBe(rowsBefore);
      expect(await eventuallyEmpty(() => orphanFiles(server))).toEqual([]);
      expect(await eventuallyEmpty(() => spoolFiles(server))).toEqual([]);
    });
  });
});
