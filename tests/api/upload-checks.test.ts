// Upload checks are bounded: a file whose header hides hours of audio is decoded only to the duration limit
// (20 minutes on the test server) and refused in plain words; one that declares them is refused from its
// header. The files are silence made here with ffmpeg (their lengths known by construction).
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { query, servers, signedInUser } from './helpers';

const work = fs.mkdtempSync(path.join(os.tmpdir(), 'tactus-upload-checks-'));
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));

/** Three hours of silence as FLAC (about 2 MB). */
function threeHourFlac(): Buffer {
  const file = path.join(work, 'three-hours.flac');
  execFileSync('ffmpeg', [
    '-v',
    'error',
    '-y',
    '-f',
    'lavfi',
    '-i',
    'anullsrc=r=8000:cl=mono',
    '-t',
    '10800',
    '-c:a',
    'flac',
    file,
  ]);
  return fs.readFileSync(file);
}

/**
 * The same file with its length hidden: FLAC's STREAMINFO "total samples" (36 bits after the sample rate,
 * channels and bit depth) set to 0, which the FLAC format defines as "unknown" (RFC 9639, section 8.2).
 */
function hideLength(flac: Buffer): Buffer {
  const out = Buffer.from(flac);
  expect(out.toString('latin1', 0, 4)).toBe('fLaC');
  // 4 bytes "fLaC" + 4 of block header; STREAMINFO's total samples start in the low nibble of its 14th byte.
  out[8 + 13] = out[8 + 13]! & 0xf0;
  out.fill(0, 8 + 14, 8 + 18);
  return out;
}

let player: Awaited<ReturnType<typeof signedInUser>>;
let songId: string;
let flac: Buffer;
beforeAll(async () => {
  flac = threeHourFlac();
  player = await signedInUser('long-flac');
  songId = (await player.agent.post('/api/songs').send({ title: 'Quiet Harbour' }).expect(201)).body.id;
});

const recordingsOfSong = async () =>
  Number(
    (await query<{ n: bigint }>(servers.disk.db, 'SELECT COUNT(*) AS n FROM recordings WHERE songId = ?', [songId]))[0]!
      .n,
  );

test('a FLAC declaring three hours is refused from its header, in minutes', async () => {
  const res = await player.agent
    .post(`/api/songs/${songId}/recordings`)
    .field('kind', 'take')
    .attach('file', flac, 'three-hours.flac');
  expect(res.status).toBe(413);
  expect(res.body.error.message).toBe('the recording is 180 minutes long; the limit is 20 minutes');
  expect(await recordingsOfSong()).toBe(0);
});

test('a FLAC hiding its three hours is decoded only to the limit and refused in plain words', async () => {
  const started = performance.now();
  const res = await player.agent
    .post(`/api/songs/${songId}/recordings`)
    .field('kind', 'take')
    .attach('file', hideLength(flac), 'no-length.flac');
  console.log(`hidden three-hour FLAC refused in ${Math.round(performance.now() - started)} ms`);
  expect(res.status).toBe(413);
  expect(res.body.error).toEqual({
    code: 'bad_audio',
    message: 'the recording is longer than the limit of 20 minutes',
    field: 'file',
    requestId: expect.any(String),
  });
  expect(await recordingsOfSong()).toBe(0);
});

test('several long uploads at once: every one answered, and the server stays responsive', async () => {
  const hidden = hideLength(flac);
  const uploads = Array.from({ length: 5 }, (_, i) =>
    player.agent
      .post(`/api/songs/${songId}/recordings`)
      .field('kind', 'take')
      .attach('file', hidden, `no-length-${i}.flac`),
  );
  // While they are checked (two at a time, off the request thread), health still answers.
  const health = await fetch(`${servers.disk.url}/api/health`);
  expect(health.status).toBe(200);
  for (const res of await Promise.all(uploads)) expect(res.status).toBe(413);
  expect(await recordingsOfSong()).toBe(0);
});
