// A generated corpus of hostile requests, each of which must get a clear 4xx in the API's error shape and
// change nothing: damaged audio of every format (cut inside its header or part-way, bits flipped in its
// signature, zeros, noise, other kinds of file dressed as audio), hostile upload fields and names, and JSON
// bodies that are malformed, deep, huge, of the wrong types, or carry injection strings where a number, a
// time signature or an id belongs. The corpus is built here from the committed clips and fixed seeds; its
// counts are printed. Status codes as RFC 9110 §15.5 defines them (400, 404, 413, 415; 422 for content
// that is well-formed but cannot be processed).
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { query, servers, signedInUser } from './helpers';
import { root } from '@/tests/setup/processes';

const CLIPS = path.join(root, 'fixtures/clips');
const FORMATS = ['wav', 'mp3', 'flac', 'ogg', 'm4a'] as const;
const clip = (format: string) => fs.readFileSync(path.join(CLIPS, `waltz-150.${format}`));

/** A small fixed-seed generator (mulberry32), so the corpus is the same on every run. */
function seeded(seed: number) {
  return () => {
    seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

interface UploadCase {
  what: string;
  file?: { bytes: Buffer; name: string };
  fields?: Record<string, string>;
  /** The statuses a clear refusal of this case may have. */
  expect: number[];
}

function uploadCases(): UploadCase[] {
  const cases: UploadCase[] = [];
  const random = seeded(15);
  for (const format of FORMATS) {
    const whole = clip(format);
    // Cut inside the header: no format's header and first frame fit in 100 bytes with 0.2 s of audio.
    for (const n of [1, 2, 4, 8, 12, 16, 32, 44, 64, 100]) {
      cases.push({
        what: `${format} cut to ${n} bytes`,
        file: { bytes: whole.subarray(0, n), name: `cut.${format}` },
        expect: [400, 415],
      });
    }
    // The signature damaged: each of its first four bytes with one bit flipped (for MP4 the "ftyp" box name).
    const at = format === 'm4a' ? 4 : 0;
    for (let i = 0; i < 4; i++) {
      for (const bit of [0x01, 0x20]) {
        const bytes = Buffer.from(whole);
        bytes[at + i] = bytes[at + i]! ^ bit;
        cases.push({
          what: `${format} with bit ${bit} of byte ${at + i} flipped`,
          file: { bytes, name: `flip.${format}` },
          expect: [400, 415],
        });
      }
    }
    // The whole file zeroed, and as much noise, under the format's name.
    cases.push({
      what: `${format}-sized zeros`,
      file: { bytes: Buffer.alloc(whole.length), name: `zeros.${format}` },
      expect: [415],
    });
    const noise = Buffer.alloc(whole.length);
    for (let i = 0; i < noise.length; i++) noise[i] = Math.floor(random() * 256);
    cases.push({ what: `${format}-sized noise`, file: { bytes: noise, name: `noise.${format}` }, expect: [415] });
  }
  // Formats whose header states the length, cut part-way: the header promises more than the file holds.
  for (const format of ['wav', 'flac'] as const) {
    const whole = clip(format);
    for (const share of [0.3, 0.6, 0.85]) {
      cases.push({
        what: `${format} cut at ${share * 100} %`,
        file: { bytes: whole.subarray(0, Math.floor(whole.length * share)), name: `short.${format}` },
        expect: [400],
      });
    }
  }
  // Other kinds of file named as audio.
  const others: [string, Buffer][] = [
    ['a PNG', fs.readFileSync(path.join(root, 'assets/favicon.png'))],
    ['an HTML page', Buffer.from('<!doctype html><html><body><script>alert(1)</script></body></html>')],
    ['a PDF header', Buffer.from('%PDF-1.7\n%âãÏÓ\n1 0 obj\n<< /Type /Catalog >>\nendobj\n')],
    ['a ZIP header', Buffer.concat([Buffer.from('PK\u0003\u0004'), Buffer.alloc(200)])],
    ['an ELF header', Buffer.concat([Buffer.from('\u007fELF\u0002\u0001\u0001'), Buffer.alloc(200)])],
    ['a shell script', Buffer.from('#!/bin/sh\nrm -rf / --no-preserve-root\n')],
    ['JSON', Buffer.from('{"title":"not audio"}')],
    ['a RIFF/WAVE header with no chunks', Buffer.from('RIFF\u0004\u0000\u0000\u0000WAVE')],
    ['an ID3 tag and nothing else', Buffer.concat([Buffer.from('ID3\u0004\u0000\u0000\u0000\u0000\u0000\u0000')])],
    ['fLaC and nothing else', Buffer.from('fLaC')],
    ['OggS and nothing else', Buffer.from('OggS')],
  ];
  for (const [what, bytes] of others) cases.push({ what, file: { bytes, name: 'take.mp3' }, expect: [400, 415] });
  cases.push({ what: 'an empty file', file: { bytes: Buffer.alloc(0), name: 'empty.mp3' }, expect: [400] });

  // Hostile fields and names with a good file.
  const good = clip('mp3');
  const withFile = (what: string, fields: Record<string, string>, name = 'take.mp3', expect = [400]) =>
    cases.push({ what, file: { bytes: good, name }, fields, expect });
  for (const kind of [
    '',
    'TAKE',
    'takes',
    "take' OR '1'='1",
    'reference; DROP TABLE recordings',
    '<script>',
    '0',
    'null',
  ])
    withFile(`kind "${kind}"`, { kind });
  withFile('a label of 201 characters', { kind: 'take', label: 'x'.repeat(201) });
  withFile('a label of 5000 characters', { kind: 'take', label: 'é'.repeat(5000) }, 'take.mp3', [400]);
  for (const name of [
    '../../etc/passwd',
    '..\\..\\windows\\win.ini',
    'a/b.mp3',
    'take\u0000.mp3',
    'take\u202egpm.mp3',
    'take\u0007.mp3',
    'line\nbreak.mp3',
  ])
    withFile(`file name ${JSON.stringify(name)}`, { kind: 'take' }, name);
  cases.push({ what: 'no file at all', fields: { kind: 'take' }, expect: [400] });
  cases.push({ what: 'no kind', file: { bytes: good, name: 'take.mp3' }, fields: {}, expect: [400] });
  return cases;
}

interface JsonCase {
  what: string;
  method: 'post' | 'patch' | 'get' | 'delete';
  /** `:song` is replaced by the player's song id. */
  path: string;
  body?: string | object;
  contentType?: string;
  expect: number[];
}

const INJECTIONS = [
  "' OR '1'='1",
  '1; DROP TABLE songs; --',
  '" OR ""="',
  '<script>alert(1)</script>',
  '{{7*7}}',
  '${7*7}',
  '../../../etc/passwd',
  '%00',
  '\u0000',
  '$where: 1',
  '{"$gt": ""}',
  'SLEEP(5)',
];

function jsonCases(): JsonCase[] {
  const cases: JsonCase[] = [];
  const wrongTypes: unknown[] = [123, true, null, [], {}, ['a'], { $gt: '' }];
  const add = (what: string, c: Omit<JsonCase, 'what'>) => cases.push({ what, ...c });
  // Every field of a new song with a value of the wrong type or out of range.
  for (const v of [...wrongTypes, '', '   ', 'x'.repeat(201)]) {
    if (v !== null)
      add(`title ${JSON.stringify(v).slice(0, 20)}`, {
        method: 'post',
        path: '/api/songs',
        body: { title: v },
        expect: [400],
      });
  }
  add('title null', { method: 'post', path: '/api/songs', body: { title: null }, expect: [400] });
  for (const v of [123, true, [], {}, 'x'.repeat(201)])
    add(`composer ${JSON.stringify(v).slice(0, 20)}`, {
      method: 'post',
      path: '/api/songs',
      body: { title: 'T', composer: v },
      expect: [400],
    });
  for (const v of ['4', '0/4', '4/3', '20/4', '4/4/4', ' 4/4', '٤/٤', 44, null, true, [], ...INJECTIONS])
    add(`meter ${JSON.stringify(v).slice(0, 24)}`, {
      method: 'post',
      path: '/api/songs',
      body: { title: 'T', meter: v },
      expect: [400],
    });
  for (const field of ['goalBpm', 'workingBpm', 'chosenBpm']) {
    for (const v of [29, 301, -1, 0, 1e308, '120', true, [], {}, 'fast', ...INJECTIONS.slice(0, 4)])
      add(`${field} ${JSON.stringify(v).slice(0, 20)}`, {
        method: 'post',
        path: '/api/songs',
        body: { title: 'T', [field]: v },
        expect: [400],
      });
  }
  add('notes of 5001 characters', {
    method: 'post',
    path: '/api/songs',
    body: { title: 'T', notes: 'n'.repeat(5001) },
    expect: [400],
  });
  // The same wrong values as a change to the player's song: refused, and the song left as it was.
  for (const body of [
    { title: '' },
    { title: 5 },
    { meter: '5/5' },
    { workingBpm: '90' },
    { goalBpm: 1000 },
    { chosenBpm: -5 },
    { notes: 42 },
  ])
    add(`change ${JSON.stringify(body)}`, { method: 'patch', path: '/api/songs/:song', body, expect: [400] });
  // Tempos, candidates, the chosen tempo and practice entries with the wrong types.
  for (const body of [{ workingBpm: 'x' }, { goalBpm: 500 }, { workingBpm: 100, extra: 1 }, [], { workingBpm: 29 }])
    add(`song tempos ${JSON.stringify(body)}`, {
      method: 'patch',
      path: '/api/songs/:song/tempos',
      body,
      expect: [400],
    });
  for (const body of [
    {},
    { bpm: '120' },
    { bpm: 120, rating: 6 },
    { bpm: 120, rating: 2.5 },
    { bpm: 120, note: 'n'.repeat(501) },
    { bpm: 10 },
  ])
    add(`candidate ${JSON.stringify(body).slice(0, 30)}`, {
      method: 'post',
      path: '/api/songs/:song/candidates',
      body,
      expect: [400],
    });
  for (const body of [{}, { bpm: 'fast' }, { bpm: 400 }, { bpm: null }])
    add(`choose ${JSON.stringify(body)}`, { method: 'post', path: '/api/songs/:song/choose', body, expect: [400] });
  for (const body of [
    { bpm: 'x' },
    { bpm: 90, minutes: -5 },
    { bpm: 90, passage: 'p'.repeat(201) },
    { bpm: 90, startSec: 'zero' },
  ])
    add(`practice ${JSON.stringify(body).slice(0, 30)}`, {
      method: 'post',
      path: '/api/songs/:song/practice',
      body,
      expect: [400],
    });
  // Malformed JSON and JSON that is not an object.
  for (const raw of [
    '{',
    '{"title":}',
    "{'title':'x'}",
    '{"title":"x",}',
    '{"title":"x"} trailing',
    'null',
    '"a string"',
    '123',
    'true',
    '[]',
    '[1,2,3]',
    '\u00ef\u00bb\u00bf{"title":',
    'NaN',
    '{"title": NaN}',
    '{"title": Infinity}',
  ])
    add(`raw body ${JSON.stringify(raw).slice(0, 24)}`, {
      method: 'post',
      path: '/api/songs',
      body: raw,
      contentType: 'application/json',
      expect: [400],
    });
  // Deep and huge JSON.
  for (const depth of [1_000, 100_000])
    add(`arrays nested ${depth} deep`, {
      method: 'post',
      path: '/api/songs',
      body: '['.repeat(depth) + ']'.repeat(depth),
      contentType: 'application/json',
      expect: [400],
    });
  add('an object nested 50 000 deep', {
    method: 'post',
    path: '/api/songs',
    body: '{"a":'.repeat(50_000) + '1' + '}'.repeat(50_000),
    contentType: 'application/json',
    expect: [400],
  });
  add('a 2 MB body', {
    method: 'post',
    path: '/api/songs',
    body: JSON.stringify({ title: 'T', notes: 'n'.repeat(2_000_000) }),
    contentType: 'application/json',
    expect: [413],
  });
  add('100 000 keys', {
    method: 'post',
    path: '/api/songs',
    body: JSON.stringify(Object.fromEntries(Array.from({ length: 100_000 }, (_, i) => [`k${i}`, i]))),
    contentType: 'application/json',
    expect: [400, 413],
  });
  // Odd encodings.
  add('a body declared UTF-16', {
    method: 'post',
    path: '/api/songs',
    body: '{"title":"x"}',
    contentType: 'application/json; charset=utf-16',
    expect: [400, 415],
  });
  add('a body declared in an unknown charset', {
    method: 'post',
    path: '/api/songs',
    body: '{"title":"x"}',
    contentType: 'application/json; charset=x-unknown',
    expect: [415],
  });
  add('a meter in invalid UTF-8', {
    method: 'post',
    path: '/api/songs',
    body: Buffer.concat([
      Buffer.from('{"title":"T","meter":"4/'),
      Buffer.from([0xff, 0xfe]),
      Buffer.from('"}'),
    ]) as unknown as string,
    contentType: 'application/json',
    expect: [400],
  });
  // Injection strings where an id belongs: no such song (404), never an error of the database.
  for (const inj of INJECTIONS) {
    const id = encodeURIComponent(inj);
    add(`song id ${JSON.stringify(inj)}`, { method: 'get', path: `/api/songs/${id}`, expect: [400, 404] });
    add(`change of song id ${JSON.stringify(inj)}`, {
      method: 'patch',
      path: `/api/songs/${id}`,
      body: { title: 'x' },
      expect: [400, 404],
    });
    add(`recording id ${JSON.stringify(inj)}`, { method: 'delete', path: `/api/recordings/${id}`, expect: [400, 404] });
  }
  return cases;
}

let player: Awaited<ReturnType<typeof signedInUser>>;
let songId: string;
let songBefore: unknown;
const tally = new Map<number, number>();
const count = (status: number) => tally.set(status, (tally.get(status) ?? 0) + 1);

beforeAll(async () => {
  player = await signedInUser('hostile-corpus');
  songId = (
    await player.agent
      .post('/api/songs')
      .send({ title: 'Kessel Bay Hornpipe', meter: '4/4', workingBpm: 96 })
      .expect(201)
  ).body.id;
  songBefore = (await player.agent.get(`/api/songs/${songId}`).expect(200)).body;
});

afterAll(() => {
  const total = [...tally.values()].reduce((a, b) => a + b, 0);
  const by = [...tally.entries()].sort(([a], [b]) => a - b).map(([s, n]) => `${s}×${n}`);
  console.log(`hostile corpus: ${total} cases, each refused with a clear 4xx (${by.join(', ')})`);
});

/** A refusal in the API's error shape, with a plain message and no stack trace. */
function expectClearRefusal(res: request.Response, expected: number[], what: string) {
  if (!expected.includes(res.status))
    throw new Error(`${what}: expected ${expected.join(' or ')}, got ${res.status} ${res.text.slice(0, 200)}`);
  expect(res.body.error.code).toEqual(expect.any(String));
  expect(res.body.error.message).toEqual(expect.any(String));
  expect(res.body.error.message.length).toBeGreaterThan(3);
  expect(res.text).not.toMatch(/at .*\.(ts|js):\d+|Sequelize|SQL syntax|ER_/);
  count(res.status);
}

/** Runs `items` through `run`, `width` at a time. */
async function inBatches<T>(items: T[], width: number, run: (item: T) => Promise<void>) {
  for (let i = 0; i < items.length; i += width) await Promise.all(items.slice(i, i + width).map(run));
}

test('hostile uploads are each refused with a clear 4xx, and nothing is stored', async () => {
  const cases = uploadCases();
  expect(cases.length).toBeGreaterThanOrEqual(100);
  // Uploads are rate-limited per player (60 an hour by default, refused ones included): each player sends at
  // most 50 of the cases, into a song of their own.
  const PER_PLAYER = 50;
  const uploaders: { agent: typeof player.agent; songId: string }[] = [];
  for (let i = 0; i < Math.ceil(cases.length / PER_PLAYER); i++) {
    const p = await signedInUser(`hostile-uploads-${i}`);
    const song = (
      await p.agent
        .post('/api/songs')
        .send({ title: `Pier Street Reel ${i + 1}`, meter: '4/4' })
        .expect(201)
    ).body;
    uploaders.push({ agent: p.agent, songId: song.id });
  }
  await inBatches(
    cases.map((c, i) => ({ c, to: uploaders[Math.floor(i / PER_PLAYER)]! })),
    4,
    async ({ c, to }) => {
      let req = to.agent.post(`/api/songs/${to.songId}/recordings`);
      for (const [k, v] of Object.entries(c.fields ?? { kind: 'take' })) req = req.field(k, v);
      // filepath: the name is sent as given, folders and all (form-data would otherwise keep only its last part).
      if (c.file)
        req = req.attach('file', c.file.bytes, {
          filepath: c.file.name,
          contentType: 'application/octet-stream',
        } as unknown as { filename: string });
      expectClearRefusal(await req, c.expect, c.what);
    },
  );
  const rows = await query<{ n: bigint }>(
    servers.disk.db,
    `SELECT COUNT(*) AS n FROM recordings WHERE songId IN (${uploaders.map(() => '?').join(', ')})`,
    uploaders.map((u) => u.songId),
  );
  expect(Number(rows[0]!.n)).toBe(0);
  // No spool file is left behind. Other test files upload to this server at the same time, so a file in
  // flight may be seen for a moment: wait for the folder to empty rather than read it once.
  const spool = servers.disk.spool;
  const until = Date.now() + 15_000;
  let left = fs.existsSync(spool) ? fs.readdirSync(spool) : [];
  while (left.length && Date.now() < until) {
    await new Promise((r) => setTimeout(r, 100));
    left = fs.readdirSync(spool);
  }
  expect(left).toEqual([]);
}, 180_000);

test('hostile JSON bodies and ids are each refused with a clear 4xx, and nothing changes', async () => {
  const cases = jsonCases();
  expect(cases.length).toBeGreaterThanOrEqual(100);
  await inBatches(cases, 8, async (c) => {
    const url = c.path.replace(':song', songId);
    let req = player.agent[c.method as 'post'](url);
    if (c.contentType) req = req.set('Content-Type', c.contentType);
    const res = c.body === undefined ? await req : await req.send(c.body as object);
    expectClearRefusal(res, c.expect, c.what);
  });
  // Nothing was created or changed: the player still has the one song, as it was.
  const songs = (await player.agent.get('/api/songs').expect(200)).body.songs;
  expect(songs).toHaveLength(1);
  expect((await player.agent.get(`/api/songs/${songId}`).expect(200)).body).toEqual(songBefore);
  for (const table of ['candidate_tempos', 'practice_entries']) {
    const rows = await query<{ n: bigint }>(servers.disk.db, `SELECT COUNT(*) AS n FROM ${table} WHERE songId = ?`, [
      songId,
    ]);
    expect(Number(rows[0]!.n)).toBe(0);
  }
}, 120_000);
