// Duration arithmetic against worked examples checkable by hand (the practice issue lists them; a beat at
// B BPM lasts 60 / B s). 6/8 counted in dotted quarters and 7/8 in eighths: common practice.
import { barsIn, beatName, beatsInBar, bpmToFit, secondsFor } from '@/audio/practice/duration';

test('32 bars of 4/4 at 120 BPM last 64.0 s (128 beats × 0.5 s)', () => {
  expect(secondsFor(32 * beatsInBar('4/4'), 120)).toBeCloseTo(64.0, 9);
});

test('3:00 of 4/4 at 90 BPM holds 67.5 bars (270 beats ÷ 4)', () => {
  expect(barsIn(180, 90, beatsInBar('4/4'))).toBeCloseTo(67.5, 9);
});

test('412 beats at 103 BPM last 4:00.0 (412 × 60 ÷ 103 = 240 s)', () => {
  expect(secondsFor(412, 103)).toBeCloseTo(240, 9);
});

test('fitting 412 beats into 3:30.0 needs 117.7 BPM (412 × 60 ÷ 210)', () => {
  expect(Math.round(bpmToFit(412, 210) * 10) / 10).toBe(117.7);
});

test('6/8 at 60 dotted-quarter BPM: 16 bars last 32.0 s (two beats a bar)', () => {
  expect(beatsInBar('6/8')).toBe(2);
  expect(beatName('6/8')).toBe('dotted quarter note');
  expect(secondsFor(16 * beatsInBar('6/8'), 60)).toBeCloseTo(32.0, 9);
  // Counted in eighths instead, the same music is 180 BPM: six eighths a bar.
  expect(beatsInBar('6/8', 'written')).toBe(6);
  expect(secondsFor(16 * beatsInBar('6/8', 'written'), 180)).toBeCloseTo(32.0, 9);
});

test('7/8 counted in eighths at 210: 8 bars last 16.0 s (56 eighths × 60 ÷ 210)', () => {
  expect(beatsInBar('7/8', 'written')).toBe(7);
  expect(beatName('7/8', 'written')).toBe('eighth note');
  expect(secondsFor(8 * beatsInBar('7/8', 'written'), 210)).toBeCloseTo(16.0, 9);
});

test('3/4 at 150: 48 bars last 57.6 s (144 beats × 0.4 s)', () => {
  expect(beatName('3/4')).toBe('quarter note');
  expect(secondsFor(48 * beatsInBar('3/4'), 150)).toBeCloseTo(57.6, 9);
});
