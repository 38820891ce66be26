// Beat-grid edges, on signals and envelopes whose truth is exact by construction.
import { trackBeats } from '@/audio/analysis/beats';

test('a clip cut in mid-sound (its first onset 40× any other) keeps its beats to the end', () => {
  // An onset envelope with a pulse every 100 frames, the first one far louder, as a cut in mid-chord gives.
  const onset = new Float32Array(2050);
  for (let f = 0; f < onset.length; f += 100) onset[f] = f === 0 ? 40 : 1;
  const beats = trackBeats(onset, new Float32Array(onset.length).fill(100)).map(Math.round);
  expect(beats).toEqual(Array.from({ length: 21 }, (_, i) => 100 * i));
});
