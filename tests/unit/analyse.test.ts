// The tempo engine on signals whose truth is exact by construction (click times are placed to the sample):
// steady clicks, a ramp, silence, a single chord and very short inputs.
import { analyse } from '@/audio/analysis/analyse';
import type { Analysis } from '@/shared/analysis';
import { beatFMeasure } from '@/audio/analysis/evaluation';
import { backbeatGroove, clickTrack, rampBeats, RATE, singleChord, steadyBeats, tempoAt } from './signals';

describe('steady click tracks', () => {
  test.each([60, 120, 177])('%p BPM reads within 0.5 BPM, every click a beat', async (bpm) => {
    const truth = steadyBeats(bpm, 30);
    const a = await analyse(clickTrack(truth, 30), RATE);
    expect(Math.abs(a.bpm! - bpm)).toBeLessThanOrEqual(0.5);
    expect(a.beatCount).toBe(truth.length);
    expect(beatFMeasure(truth, a.beats)).toBe(1);
    expect(a.confidence).toBeGreaterThan(0.8);
    expect(a.candidates[0]).toMatchObject({ relation: 'primary' });
    expect(a.stabilityCv!).toBeLessThan(0.01);
  });

  test('beat times land on the clicks within 5 ms', async () => {
    const truth = steadyBeats(96, 30);
    const a = await analyse(clickTrack(truth, 30), RATE);
    const errors = a.beats.map((b, i) => Math.abs(b - truth[i]!));
    expect(Math.max(...errors)).toBeLessThan(0.005);
  });

  test('a steady 124 BPM reads 124.0, not a neighbouring lag of the frame grid', async () => {
    const a = await analyse(clickTrack(steadyBeats(124, 40), 40), RATE);
    expect(a.bpm!.toFixed(1)).toBe('124.0');
  });

  test('the half and double tempos are offered and named', async () => {
    const a = await analyse(clickTrack(steadyBeats(120, 30), 30), RATE);
    const relations = Object.fromEntries(a.candidates.map((c) => [c.relation, c.bpm]));
    expect(relations.half).toBeCloseTo(60, 0);
    for (const c of a.candidates) expect(c.bpm).toBeGreaterThanOrEqual(30);
  });

  test('an accented first beat of every three gives 3/4 with downbeats on the accents', async () => {
    const truth = steadyBeats(132, 30);
    const accents = new Set(truth.map((_, i) => i).filter((i) => i % 3 === 0));
    // The accent is a louder click with a low thump under it, as a bass note on the downbeat would be.
    const clicks = clickTrack(truth, 30, RATE, accents);
    truth.forEach((t, i) => {
      if (!accents.has(i)) return;
      const start = Math.round(t * RATE);
      for (let k = 0; k < 0.08 * RATE && start + k < clicks.length; k++)
        clicks[start + k]! += 0.6 * Math.exp(-k / (0.03 * RATE)) * Math.sin((2 * Math.PI * 70 * k) / RATE);
    });
    const a = await analyse(clicks, RATE);
    expect(a.meter).toBe('3/4');
    const expected = truth.filter((_, i) => accents.has(i));
    expect(beatFMeasure(expected, a.downbeats)).toBeGreaterThan(0.95);
  });
});

describe('a backbeat groove (kick on 1 and 3, snare on 2 and 4, hi-hat on every eighth)', () => {
  // The hi-hat's eighths are as complete a pulse as the quarters, but the bass plays only on the quarters: the
  // beat is the quarter note (common practice). Before the bass had to agree, 92 read as 184.
  test.each([92, 100])('%p BPM reads at the quarter note, every beat found', async (bpm) => {
    const g = backbeatGroove(bpm, 30);
    const a = await analyse(g.x, RATE);
    expect(Math.abs(a.bpm! / bpm - 1)).toBeLessThan(0.01);
    expect(beatFMeasure(g.beats, a.beats)).toBeGreaterThan(0.95);
  });
});

describe('a tempo ramp 90 → 130 BPM over 40 s', () => {
  const truth = rampBeats(90, 130, 40);
  let a: Analysis;
  beforeAll(async () => {
    a = await analyse(clickTrack(truth, 40), RATE);
  });

  test('the beat grid follows the ramp', () => {
    expect(beatFMeasure(truth, a.beats)).toBeGreaterThan(0.97);
  });

  test('the curve stays within 2 % of the true tempo', () => {
    const errors = a.curve.map((p) => Math.abs(p.bpm / tempoAt(90, 130, 40, p.t - 0.5) - 1));
    errors.sort((x, y) => x - y);
    expect(errors[Math.floor(errors.length / 2)]!).toBeLessThan(0.02);
    expect(a.curve.length).toBeGreaterThan(30);
  });

  test('start, end and drift are reported', () => {
    expect(a.startBpm!).toBeGreaterThan(88);
    expect(a.startBpm!).toBeLessThan(96);
    expect(a.endBpm!).toBeGreaterThan(124);
    expect(a.endBpm!).toBeLessThan(131);
    expect(a.driftPct!).toBeGreaterThan(30);
  });
});

describe('nothing to find', () => {
  test('silence: no tempo, no beats, zero confidence, no crash', async () => {
    const a = await analyse(new Float32Array(RATE * 10), RATE);
    expect(a).toMatchObject({ bpm: null, confidence: 0, beats: [], beatCount: 0, meter: null });
    expect(a.durationSec).toBeCloseTo(10, 3);
  });

  test('a single sustained chord: low confidence', async () => {
    const a = await analyse(singleChord(8), RATE);
    expect(a.confidence).toBeLessThan(0.3);
  });

  test.each([0, 1, 100, RATE / 2, RATE * 2])('a very short input of %p samples does not crash', async (n) => {
    const a = await analyse(clickTrack(steadyBeats(120, n / RATE), n / RATE), RATE);
    expect(a.durationSec).toBeCloseTo(n / RATE, 3);
    expect(a.beats.length).toBeLessThanOrEqual(5);
  });
});

test('the same input gives the same numbers', async () => {
  const signal = clickTrack(rampBeats(100, 112, 20), 20);
  const strip = ({ analysisMs, ...rest }: Analysis) => rest;
  expect(strip(await analyse(signal, RATE))).toEqual(strip(await analyse(signal.slice(), RATE)));
});

test('audio at 44.1 kHz is resampled to the analysis rate and reads the same tempo', async () => {
  const truth = steadyBeats(140, 20);
  const a = await analyse(clickTrack(truth, 20, 44100), 44100);
  expect(Math.abs(a.bpm! - 140)).toBeLessThanOrEqual(0.5);
});

describe('metrical level', () => {
  // Two pulses an octave apart: clicks at 70 BPM and, between them, clicks at one fifth of the amplitude,
  // so the 140 BPM pulse has every other beat accented. Heard either way (a slow beat with off-beats, or a
  // fast one accented on one and three), so the engine must say so and offer both tempos.
  const fast = steadyBeats(140, 30);
  const strong = clickTrack(
    fast.filter((_, i) => i % 2 === 0),
    30,
  );
  const soft = clickTrack(
    fast.filter((_, i) => i % 2 === 1),
    30,
  );
  const both = strong.map((v, i) => v + 0.2 * soft[i]!);

  test('pulses at 70 and 140 BPM of about equal weight: flagged ambiguous, both tempos with their strengths', async () => {
    const a = await analyse(both, RATE);
    expect(a.levelAmbiguous).toBe(true);
    const tempos = a.levels.map((l) => l.bpm).sort((x, y) => x - y);
    expect(tempos).toHaveLength(2);
    // Within 4 % (Accuracy1's tolerance, Gouyon et al. 2006) of 70 and of 140.
    expect(Math.abs(tempos[0]! / 70 - 1)).toBeLessThanOrEqual(0.04);
    expect(Math.abs(tempos[1]! / 140 - 1)).toBeLessThanOrEqual(0.04);
    for (const l of a.levels) expect(l.strength).toBeGreaterThan(0.25);
  });

  test.each([120, 60, 177])('a plain %p BPM click track is not ambiguous', async (bpm) => {
    const a = await analyse(clickTrack(steadyBeats(bpm, 30), 30), RATE);
    expect(a.levelAmbiguous).toBe(false);
    expect(Math.abs(a.levels[0]!.bpm / bpm - 1)).toBeLessThanOrEqual(0.04);
  });
});
