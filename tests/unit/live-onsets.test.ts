// The capture worklet's onset detector on signals whose onsets are known by construction (fixtures/live-takes.ts).
import { OnsetDetector, REFRACTORY_SEC, HOP } from '@/audio/live/onsets';
import { hitTrain, steadyThenRushing } from '@/fixtures/live-takes';

const SR = 44100;

/** Runs the detector block by block as the worklet does (128-sample render quanta), from context time `t0`. */
function detect(x: Float32Array, t0 = 0, block = HOP): number[] {
  const d = new OnsetDetector(SR);
  const out: number[] = [];
  for (let i = 0; i < x.length; i += block) out.push(...d.push(x.subarray(i, i + block), t0 + i / SR));
  return out;
}

test('every hit is found once, to within a millisecond of its true start', () => {
  const { times } = steadyThenRushing(100, 8, 6, 30, 0.3);
  const found = detect(hitTrain(times, SR, 9));
  expect(found).toHaveLength(times.length);
  found.forEach((t, i) => expect(Math.abs(t - times[i]!)).toBeLessThan(0.001));
});

test('times are on the context clock of the blocks, and any block length gives the same onsets', () => {
  const times = [0.2, 0.7, 1.13];
  const x = hitTrain(times, SR, 1.5);
  const a = detect(x, 10);
  const b = detect(x, 10, 1000);
  expect(a).toHaveLength(3);
  a.forEach((t, i) => expect(t - 10).toBeCloseTo(times[i]!, 3));
  b.forEach((t, i) => expect(t).toBeCloseTo(a[i]!, 4));
});

test('a hit inside the refractory period after another is not a second onset; silence and faint noise give none', () => {
  const close = [0.3, 0.3 + REFRACTORY_SEC / 2, 0.9];
  expect(detect(hitTrain(close, SR, 1.2))).toHaveLength(2);
  expect(detect(new Float32Array(SR))).toEqual([]);
  // Noise at about −60 dBFS: below the floor, however it wobbles.
  let seed = 1;
  const noise = Float32Array.from({ length: SR }, () => {
    seed = (seed * 16807) % 2147483647;
    return (seed / 2147483647 - 0.5) * 0.002;
  });
  expect(detect(noise)).toEqual([]);
});

test('hits over a loud tone still show as a rise above the background', () => {
  const x = hitTrain([0.5, 1.0], SR, 1.5);
  for (let i = 0; i < x.length; i++) x[i]! += 0.05 * Math.sin((2 * Math.PI * 220 * i) / SR);
  // The tone's own start is the first onset; the hits come after it.
  const found = detect(x);
  expect(found).toHaveLength(3);
  expect(Math.abs(found[1]! - 0.5)).toBeLessThan(0.002);
  expect(Math.abs(found[2]! - 1.0)).toBeLessThan(0.002);
});
