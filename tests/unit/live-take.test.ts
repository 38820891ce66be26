// The capture worklet's host and the take it records: samples cut to the recorded span on the click's clock,
// shifted by the latency, written as a WAV file FFmpeg reads back (the check does not rest on our own reader).
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { CaptureHost, type FromCapture } from '@/audio/live/capture-host';
import { assembleTake, takeWav, type CapturedChunk } from '@/audio/live/take';
import { hitTrain } from '@/fixtures/live-takes';

const SR = 44100;

function run(x: Float32Array, t0: number, recordFrom: number) {
  const got: FromCapture[] = [];
  const host = new CaptureHost(
    SR,
    (m) => got.push(m),
    () => 0,
  );
  host.receive({ type: 'record', from: recordFrom });
  for (let i = 0; i < x.length; i += 128) host.process(x.subarray(i, i + 128), t0 + i / SR);
  host.receive({ type: 'stop' });
  return got;
}

test('the host reports onsets on the context clock, the level, and the recorded samples from the asked time', () => {
  const x = hitTrain([0.25, 0.75], SR, 1);
  const got = run(x, 5, 5.1);
  const onsets = got.flatMap((m) => (m.type === 'onset' ? [m.time] : []));
  expect(onsets.map((t) => t - 5)).toEqual([expect.closeTo(0.25, 3), expect.closeTo(0.75, 3)]);
  expect(Math.max(...got.flatMap((m) => (m.type === 'level' ? [m.peak] : [])))).toBeGreaterThan(0.3);
  const chunks = got.flatMap((m) => (m.type === 'audio' ? [{ time: m.time, samples: m.samples }] : []));
  expect(chunks[0]!.time).toBeCloseTo(5.1, 4);
  const total = chunks.reduce((n, c) => n + c.samples.length, 0);
  expect(total).toBe(x.length - Math.round(0.1 * SR));
  expect(got[got.length - 1]).toEqual({ type: 'stopped' });
});

test('the take is cut to its span and moved earlier by the latency', () => {
  const x = Float32Array.from({ length: SR }, (_, i) => i / SR);
  const chunks: CapturedChunk[] = [
    { time: 2, samples: x.subarray(0, 20000) },
    { time: 2 + 20000 / SR, samples: x.subarray(20000) },
  ];
  // Heard from 2.2 to 2.5 with 50 ms latency: the samples stamped 2.25 … 2.55.
  const take = assembleTake(chunks, 2.2, 2.5, 0.05, SR);
  expect(take.length).toBe(Math.round(0.3 * SR));
  expect(take[0]).toBeCloseTo(0.25, 4);
  expect(take[take.length - 1]).toBeCloseTo(0.55, 3);
  // Asked for more than was captured: the rest is silence, nothing is invented.
  expect(
    assembleTake(chunks, 2.9, 3.2, 0, SR)
      .slice(-100)
      .every((v) => v === 0),
  ).toBe(true);
});

test('the take is a mono 16-bit WAV that FFmpeg reads back sample for sample', () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tactus-take-'));
  try {
    const x = Float32Array.from({ length: 500 }, (_, i) => Math.sin(i / 7) * 0.5);
    const file = path.join(dir, 'take.wav');
    fs.writeFileSync(file, takeWav(x, SR));
    const probe = JSON.parse(execFileSync('ffprobe', ['-v', 'error', '-show_streams', '-of', 'json', file]).toString())
      .streams[0];
    expect(probe).toMatchObject({ codec_name: 'pcm_s16le', channels: 1, sample_rate: String(SR) });
    const raw = execFileSync('ffmpeg', ['-v', 'error', '-i', file, '-f', 's16le', '-']);
    const back = new Int16Array(raw.buffer, raw.byteOffset, raw.length / 2);
    expect(back.length).toBe(500);
    back.forEach((v, i) => expect(Math.abs(v / 32767 - x[i]!)).toBeLessThan(1 / 32767 + 1e-6));
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
});

test('the input counts as live from its first sample that is not digital silence, or after a second of zeros', () => {
  const x = new Float32Array(4000);
  x[1000] = 0.0001;
  const got = run(x, 3, 100);
  expect(got.filter((m) => m.type === 'live')).toEqual([{ type: 'live', time: 3 + 1000 / SR }]);
  const muted = run(new Float32Array(2 * SR), 3, 100).filter((m) => m.type === 'live');
  expect(muted).toHaveLength(1);
  expect((muted[0] as { time: number }).time).toBeCloseTo(3 + Math.ceil(SR / 128) * (128 / SR), 6);
});
