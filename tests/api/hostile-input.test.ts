// Malformed requests get a clear 4xx in the API's error shape, never a 500 (findings of the security review in
// the issue tracker; HTTP semantics from RFC 9110).
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { baseUrl, signedInUser, waitForAnalysis } from './helpers';
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
  ['an unknown Content-Encoding', { 'Content-Type': 'application/json', 'Content-Encoding': 'zip-it' }, '{"title":"x"}', 415],
  ['a gzip body that is not gzip', { 'Content-Type': 'application/json', 'Content-Encoding': 'gzip' }, 'this is not gzip at all', 400],
])('%s is refused with %#', async (_what, headers, body, status) => {
  let req = player.agent.post('/api/songs');
  for (const [k, v] of Object.entries(headers)) req = req.set(k, v);
  expectClientError(await req.send(body), status);
});

test.each(['/%ZZ', '/api/songs/%ZZ', '/api/recordings/%E0%A4%A'])('a path that does not decode (%s) is a 400 or 404, not a 500', async (p) => {
  const res = await player.agent.get(p);
  expect([400, 404]).toContain(res.status);
  if (p.startsWith('/api')) expect(res.body.error.code).toEqual(expect.any(String));
});

describe('ranges of a recording’s audio (RFC 9110 §14)', () => {
  let id: string;
  let size: number;
  beforeAll(async () => {
    const clip = fs.readFileSync(path.join(root, 'fixtures/clips/waltz-150.mp3'));
    size = clip.length;
    const song = (await player.agent.post('/api/songs').send({ title: 'Ranges' }).expect(201)).body.id;
    id = (await player.agent.post(`/api/songs/${song}/recordings`).field('kind', 'take').attach('file', clip, 'w.mp3').expect(201)).body.id;
    await waitForAnalysis(player.agent, id);
  });

  test('a suffix range longer than the file serves the whole file (§14.1.2)', async () => {
    const res = await player.agent.get(`/api/recordings/${id}/audio`).set('Range', 'bytes=-999999999').buffer(true).parse((r, cb) => {
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
