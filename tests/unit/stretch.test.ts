// Time stretch (soundtouchjs through audio/playback/stretch.ts) on signals whose truth is exact by construction.
import { stretchOffline } from '@/audio/playback/stretch';
import { sineTone, zeroCrossingFrequency } from './signals';

const SR = 44100;
const tone = (hz: number, sec: number) => sineTone(hz, sec, SR);

/** Frequency away from the first and last `skip` samples (the stretch's lead-in and tail). */
const frequency = (x: Float32Array, skip = 2000) => zeroCrossingFrequency(x, SR, skip, x.length - skip);

const maxJump = (x: Float32Array) => {
  let m = 0;
  for (let i = 1; i < x.length; i++) m = Math.max(m, Math.abs(x[i]! - x[i - 1]!));
  return m;
};

describe.each([0.5, 0.7, 0.85, 1.15, 1.5, 2.0])('stretching a 440 Hz tone to %p × its tempo', (ratio) => {
  const input = tone(440, 8);
  const out = stretchOffline({ left: input, right: input }, ratio);

  test('the output lasts input × original / target, within 1 %', () => {
    const expected = input.length / ratio;
    expect(Math.abs(out.left.length / expected - 1)).toBeLessThan(0.01);
  });
  test('the pitch stays 440 Hz within 1 %', () => {
    expect(Math.abs(frequency(out.left) / 440 - 1)).toBeLessThan(0.01);
  });
  test('no jump between samples larger than the tone itself has (block joins are seamless)', () => {
    // A sine of amplitude A at f moves at most 2πf/sr·A per sample; allow 5 % for the cross-fades.
    expect(maxJump(out.left)).toBeLessThanOrEqual(maxJump(input) * 1.05);
  });
});

test.each([0.5, 0.7, 0.85, 1.15, 1.5, 2.0])('a 55 Hz bass tone (A1) keeps its pitch within 2 %% at %p ×', (ratio) => {
  // Short overlap-add sequences (audio/playback/stretch.ts) keep attacks in time but cut low notes into fewer periods;
  // measured worst case with our settings 1.6 % (SoundTouch's automatic settings 1.2 %).
  const input = tone(55, 8);
  const out = stretchOffline({ left: input, right: input }, ratio);
  expect(Math.abs(frequency(out.left, 4000) / 55 - 1)).toBeLessThan(0.02);
});
