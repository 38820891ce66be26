// The upload checks' pool (server/analysis/check-pool.ts) and the capped decode under it: a fixed number of
// checks at once, a bounded line behind them, a time limit, and a decode that stops at the duration limit.
// Files are the committed clips and silence generated here (its length known by construction).
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { CheckPool } from '@/server/analysis/check-pool';
import { decodedSeconds } from '@/server/analysis/decode';
import { HttpError } from '@/server/http';

const CLIP = path.resolve(__dirname, '../../fixtures/clips/waltz-150.flac');
const work = fs.mkdtempSync(path.join(os.tmpdir(), 'tactus-check-pool-'));
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));

/** Ten minutes of 8 kHz silence as FLAC (small: silence compresses to almost nothing). */
function silence(seconds: number) {
  const file = path.join(work, `silence-${seconds}.flac`);
  execFileSync('ffmpeg', [
    '-v',
    'error',
    '-y',
    '-f',
    'lavfi',
    '-i',
    'anullsrc=r=8000:cl=mono',
    '-t',
    String(seconds),
    '-c:a',
    'flac',
    file,
  ]);
  return file;
}

test('the decode that counts a file’s length stops at the limit it is given', async () => {
  const file = silence(600);
  expect(await decodedSeconds(file, 8000, 30)).toBeCloseTo(30, 1);
  expect(await decodedSeconds(file, 8000)).toBeCloseTo(600, 1);
});

test('one check at a time with two waiting: the next upload is refused as busy, the others are answered', async () => {
  const pool = new CheckPool(1, 2, 60_000);
  try {
    const answers = [0, 1, 2, 3].map((i) =>
      pool.check(i === 1 ? __filename : CLIP, 1200).then(
        (audio) => ({ ok: true as const, audio }),
        (err: HttpError) => ({ ok: false as const, status: err.status, code: err.code }),
      ),
    );
    const [first, second, third, fourth] = await Promise.all(answers);
    expect(first).toEqual({ ok: true, audio: expect.objectContaining({ format: 'flac', mimeType: 'audio/flac' }) });
    // This test file is text: refused as not audio (415), the refusal carried back from the worker intact.
    expect(second).toEqual({ ok: false, status: 415, code: 'bad_audio' });
    expect(third).toEqual({ ok: true, audio: expect.objectContaining({ format: 'flac' }) });
    expect(fourth).toEqual({ ok: false, status: 503, code: 'busy' });
  } finally {
    await pool.close();
  }
});

test('a check that outlasts its time limit is refused and its worker replaced', async () => {
  const pool = new CheckPool(1, 2, 1);
  try {
    await expect(pool.check(CLIP, 1200)).rejects.toMatchObject({ status: 422, code: 'bad_audio' });
    expect(pool.load()).toEqual({ running: 0, waiting: 0 });
  } finally {
    await pool.close();
  }
});
