// The rendered corpus against the tempo maps it was made from (fixtures/pieces.ts: truth by construction).
// The corpus is generated on first use and cached in fixtures/corpus/ (npm run corpus).
import path from 'node:path';
import { analyse } from '@/audio/analysis/analyse';
import { accuracy1, beatFMeasure, trimBeats } from '@/audio/analysis/evaluation';
import { decodeFile } from '@/server/analysis/decode';
import { CORPUS_DIR, ensureCorpus } from '@/fixtures/generate';
import { medianCurveError, referenceBpm, type Truth } from '@/fixtures/pieces';

let truths: Truth[] = [];
beforeAll(() => {
  truths = ensureCorpus(() => {});
}, 900_000);

test('every piece: tempo within 4 % (Accuracy1), beats within ±70 ms (F ≥ 0.85), meter, curve', async () => {
  expect(truths.length).toBeGreaterThanOrEqual(12);
  const failures: string[] = [];
  for (const truth of truths) {
    const { samples, sampleRate } = await decodeFile(path.join(CORPUS_DIR, `${truth.name}.mp3`));
    const a = await analyse(samples, sampleRate);
    const reference = referenceBpm(truth);
    if (!accuracy1(a.bpm!, reference)) failures.push(`${truth.name}: ${a.bpm} BPM, truth ${reference}`);
    const f = beatFMeasure(trimBeats(truth.beats), trimBeats(a.beats));
    if (f < 0.85) failures.push(`${truth.name}: beat F ${f.toFixed(3)}`);
    if (a.meter !== truth.meter) failures.push(`${truth.name}: meter ${a.meter}, truth ${truth.meter}`);
    if (!truth.steady) {
      const err = medianCurveError(truth, a.curve);
      if (err > 0.02) failures.push(`${truth.name}: median curve error ${(100 * err).toFixed(2)} %`);
    }
  }
  expect(failures).toEqual([]);
}, 300_000);

test('the rushing take is reported as rushing, the steady ones as steady', async () => {
  const read = async (name: string) => {
    const { samples, sampleRate } = await decodeFile(path.join(CORPUS_DIR, `${name}.mp3`));
    return analyse(samples, sampleRate);
  };
  const rushing = await read('rushing-take-100');
  // The map goes from 100 to 104 BPM: +4 %.
  expect(rushing.driftPct!).toBeGreaterThan(2.5);
  expect(rushing.driftPct!).toBeLessThan(5.5);
  const steady = await read('drums-bass-104');
  expect(Math.abs(steady.driftPct!)).toBeLessThan(0.5);
  expect(steady.stabilityCv!).toBeLessThan(0.02);
}, 120_000);
