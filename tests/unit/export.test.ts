// WAV export: our 16-bit file read back by FFmpeg (ffprobe for the header, ffmpeg for the samples), so the
// check does not rest on our own reader. Signals are exact by construction.
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { encodeWav, exportFileName, renderAtTempo } from '@/audio/playback/export';

const SR = 44100;
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tactus-wav-'));
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

function write(name: string, bytes: Uint8Array) {
  const file = path.join(dir, name);
  fs.writeFileSync(file, bytes);
  return file;
}
const probe = (file: string) =>
  JSON.parse(execFileSync('ffprobe', ['-v', 'error', '-show_streams', '-show_format', '-of', 'json', file]).toString());
/** Interleaved 16-bit samples as FFmpeg decodes them. */
const samples = (file: string) => {
  const raw = execFileSync('ffmpeg', ['-v', 'error', '-i', file, '-f', 's16le', '-c:a', 'pcm_s16le', '-']);
  return new Int16Array(raw.buffer, raw.byteOffset, raw.length / 2);
};

test('a stereo buffer becomes a 16-bit PCM WAV that FFmpeg reads back sample for sample', () => {
  const n = 1000;
  const left = Float32Array.from({ length: n }, (_, i) => Math.sin(i / 10) * 0.5);
  const right = Float32Array.from({ length: n }, (_, i) => (i % 2 ? -0.25 : 0.25));
  const file = write('exact.wav', encodeWav({ left, right }, SR));
  const s = probe(file).streams[0];
  expect(s).toMatchObject({ codec_name: 'pcm_s16le', channels: 2, sample_rate: String(SR), bits_per_sample: 16 });
  const pcm = samples(file);
  expect(pcm).toHaveLength(2 * n);
  for (let i = 0; i < n; i++) {
    expect(Math.abs(pcm[2 * i]! - Math.round(left[i]! * 32767))).toBeLessThanOrEqual(1);
    // ±0.25 of full scale: 0.25 × 32767 rounds to 8192, −0.25 × 32768 is −8192.
    expect(pcm[2 * i + 1]).toBe(i % 2 ? -8192 : 8192);
  }
});

test('values past full scale are clipped, not wrapped around', () => {
  const left = Float32Array.from([1.5, -1.5, 1, -1]);
  const pcm = samples(write('clip.wav', encodeWav({ left, right: left }, SR)));
  expect(Array.from(pcm.filter((_, i) => i % 2 === 0))).toEqual([32767, -32768, 32767, -32768]);
});

test.each([0.75, 1.25])('a passage rendered at %p × lasts its length / tempo and keeps its pitch', (tempo) => {
  // Four seconds of 440 Hz; the passage is 1 s to 3 s.
  const tone = Float32Array.from({ length: 4 * SR }, (_, i) => 0.5 * Math.sin((2 * Math.PI * 440 * i) / SR));
  const out = renderAtTempo({ left: tone, right: tone }, SR, tempo, { start: 1, end: 3 });
  const file = write(`passage-${tempo}.wav`, encodeWav(out, SR));
  expect(Number(probe(file).format.duration)).toBeCloseTo(2 / tempo, 2);
  // Pitch: count rising zero crossings in the middle second.
  const pcm = samples(file);
  let crossings = 0;
  const from = Math.round(0.25 * SR);
  const to = from + SR;
  for (let i = from + 1; i < to; i++) if (pcm[2 * (i - 1)]! < 0 && pcm[2 * i]! >= 0) crossings++;
  expect(Math.abs(crossings - 440)).toBeLessThanOrEqual(4);
});

test('an empty passage is refused', () => {
  const x = new Float32Array(SR);
  expect(() => renderAtTempo({ left: x, right: x }, SR, 1, { start: 0.5, end: 0.5 })).toThrow(/empty/);
});

test('the file name says what it is and has no characters a file system refuses', () => {
  expect(exportFileName('Copperline Reel', 93, 'bars 5–8')).toBe('Copperline Reel - bars 5–8 - 93 BPM.wav');
  expect(exportFileName('AC/DC: "live"?', 120.25, null)).toBe('AC DC live - 120.3 BPM.wav');
});
