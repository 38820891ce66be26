// Beat-grid edges and off-beat bass, on signals and envelopes whose truth is exact by construction.
import { beatsWithOffBeatBass, offBeatBassRatio, OFF_BEAT_BASS_DOUBLES, trackBeats } from '@/audio/analysis/beats';

test('a clip cut in mid-sound (its first onset 40× any other) keeps its beats to the end', () => {
  // An onset envelope with a pulse every 100 frames, the first one far louder, as a cut in mid-chord gives.
  const onset = new Float32Array(2050);
  for (let f = 0; f < onset.length; f += 100) onset[f] = f === 0 ? 40 : 1;
  const beats = trackBeats(onset, new Float32Array(onset.length).fill(100)).map(Math.round);
  expect(beats).toEqual(Array.from({ length: 21 }, (_, i) => 100 * i));
});

describe('bass between the beats', () => {
  const frames = Array.from({ length: 20 }, (_, i) => 40 + 100 * i);
  const envelope = (at: number[]) => {
    const x = new Float32Array(2100);
    for (const f of at) x[f] = 1;
    return x;
  };
  const onset = envelope([...frames, ...frames.map((f) => f + 50)]);
  // The shipped bound: 1, more bass between the beats than on them.
  const bound = OFF_BEAT_BASS_DOUBLES;

  test('bass on the midpoints only: the midpoints become beats, on their onset peaks', () => {
    const doubled = beatsWithOffBeatBass(frames, onset, envelope(frames.map((f) => f + 50)), bound);
    expect(doubled).not.toBeNull();
    expect(doubled!).toHaveLength(2 * frames.length - 1);
    expect(doubled!.filter((_, i) => i % 2 === 1).map(Math.round)).toEqual(frames.slice(0, -1).map((f) => f + 50));
  });

  test('bass on the beats (a kick on every beat): the grid stays', () => {
    expect(beatsWithOffBeatBass(frames, onset, envelope(frames), bound)).toBeNull();
  });

  test('bass equally on and between the beats (no evidence either way): the grid stays', () => {
    expect(beatsWithOffBeatBass(frames, onset, envelope([...frames, ...frames.map((f) => f + 50)]), bound)).toBeNull();
  });

  test('the ratio itself: 0 with the bass on the beats, 1 with it on and between, none for a grid too short', () => {
    expect(offBeatBassRatio(frames, envelope(frames))).toBe(0);
    expect(offBeatBassRatio(frames, envelope([...frames, ...frames.map((f) => f + 50)]))).toBeCloseTo(1, 6);
    expect(offBeatBassRatio(frames.slice(0, 3), envelope(frames))).toBeNull();
  });
});
