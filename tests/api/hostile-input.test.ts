// Malformed requests get a clear 4xx in the API's error shape, never a 500 (findings of the security review in
// the issue tracker; HTTP semantics from RFC 9110).
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { signedInUser, waitForAnalysis } from './helpers';
import { root } from '@/tests/setup/processes';

let player: Awaited<ReturnType<typeof signedInUser>>;
beforeAll(async () => {
  player = await signedInUser('hostile');
});

const expectClientError = (res: request.Response, status: number) => {
  expect(res.status).toBe(status);
  expect(res.body.error.code).toEqual(expect.any(String));
  expect(res.body.error.message).toEqual(expect.any(String));
  expect(JSON.stringify(res.body)).not.toMatch(/at .*\.(ts|js):\d+/); // no stack trace
};

test.each([
  ['an unknown charset', { 'Content-Type': 'application/json; charset=klingon' }, '{"title":"x"}', 415],
  [
    'an unknown Content-Encoding',
    { 'Content-Type': 'application/json', 'Content-Encoding': 'zip-it' },
    '{"title":"x"}',
    415,
  ],
  [
    'a gzip body that is not gzip',
    { 'Content-Type': 'application/json', 'Content-Encoding': 'gzip' },
    'this is not gzip at all',
    400,
  ],
])('%s is refused with %#', async (_what, headers, body, status) => {
  let req = player.agent.post('/api/songs');
  for (const [k, v] of Object.entries(headers)) req = req.set(k, v);
  expectClientError(await req.send(body), status);
});

test.each(['/%ZZ', '/api/songs/%ZZ', '/api/recordings/%E0%A4%A'])(
  'a path that does not decode (%s) is a 400 or 404, not a 500',
  async (p) => {
    const res = await player.agent.get(p);
    expect([400, 404]).toContain(res.status);
    if (p.startsWith('/api')) expect(res.body.error.code).toEqual(expect.any(String));
  },
);

describe('ranges of a recording’s audio (RFC 9110 §14)', () => {
  let id: string;
  let size: number;
  beforeAll(async () => {
    const clip = fs.readFileSync(path.join(root, 'fixtures/clips/waltz-150.mp3'));
    size = clip.length;
    const song = (await player.agent.post('/api/songs').send({ title: 'Ranges' }).expect(201)).body.id;
    id = (
      await player.agent
        .post(`/api/songs/${song}/recordings`)
        .field('kind', 'take')
        .attach('file', clip, 'w.mp3')
        .expect(201)
    ).body.id;
    await waitForAnalysis(player.agent, id);
  });

  test('a suffix range longer than the file serves the whole file (§14.1.2)', async () => {
    const res = await player.agent
      .get(`/api/recordings/${id}/audio`)
      .set('Range', 'bytes=-999999999')
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(206);
    expect(res.headers['content-range']).toBe(`bytes 0-${size - 1}/${size}`);
    expect((res.body as Buffer).length).toBe(size);
  });

  test('an unsatisfiable range is a 416 that does not echo the header back', async () => {
    const res = await player.agent.get(`/api/recordings/${id}/audio`).set('Range', 'bytes=999999999-<script>');
    expect(res.status).toBe(416);
    expect(res.headers['content-range']).toBe(`bytes */${size}`);
    expect(res.body.error.message).not.toContain('<script>');
  });
});

describe('names and headers of uploads', () => {
  let song: string;
  const clip = () => fs.readFileSync(path.join(root, 'fixtures/clips/waltz-150.mp3'));
  beforeAll(async () => {
    song = (await player.agent.post('/api/songs').send({ title: 'Names' }).expect(201)).body.id;
  });

  test('a UTF-8 file name is kept as sent', async () => {
    const res = await player.agent
      .post(`/api/songs/${song}/recordings`)
      .field('kind', 'take')
      .attach('file', clip(), 'Tomás – café.mp3')
      .expect(201);
    expect(res.body.originalName).toBe('Tomás – café.mp3');
  });

  test('a name with a right-to-left override is refused (Unicode TR #36, bidi spoofing)', async () => {
    const res = await player.agent
      .post(`/api/songs/${song}/recordings`)
      .field('kind', 'take')
      .attach('file', clip(), 'take\u202Egpm.mp3')
      .expect(400);
    expect(res.body.error.field).toBe('file');
  });

  test('a WAV whose header declares no channels is refused as damaged, not "Infinity minutes long"', async () => {
    // A canonical 44-byte RIFF/WAVE header (fmt chunk: PCM, 0 channels, 44 100 Hz, 16 bits) and a second of zeros.
    const data = Buffer.alloc(88200);
    const head = Buffer.alloc(44);
    head.write('RIFF', 0, 'latin1');
    head.writeUInt32LE(36 + data.length, 4);
    head.write('WAVEfmt ', 8, 'latin1');
    head.writeUInt32LE(16, 16);
    head.writeUInt16LE(1, 20); // PCM
    head.writeUInt16LE(0, 22); // channels: none
    head.writeUInt32LE(44100, 24);
    head.writeUInt32LE(0, 28); // byte rate follows from the channels
    head.writeUInt16LE(0, 32);
    head.writeUInt16LE(16, 34);
    head.write('data', 36, 'latin1');
    head.writeUInt32LE(data.length, 40);
    const res = await player.agent
      .post(`/api/songs/${song}/recordings`)
      .field('kind', 'take')
      .attach('file', Buffer.concat([head, data]), 'none.wav');
    expect([400, 413, 415]).toContain(res.status);
    expect(res.body.error.message).not.toMatch(/Infinity|NaN/);
  });

  test('a label of spaces is stored as no label', async () => {
    const id = (
      await player.agent
        .post(`/api/songs/${song}/recordings`)
        .field('kind', 'take')
        .attach('file', clip(), 'x.mp3')
        .expect(201)
    ).body.id;
    const res = await player.agent.patch(`/api/recordings/${id}`).send({ label: '    ' }).expect(200);
    expect(res.body.label).toBeNull();
  });
});
