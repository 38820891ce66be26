// Written by `npm run train:level` (fixtures/train-level.ts): the metrical-level model fitted on the 70
// GTZAN clips of ../shared/reference-data/real-recordings (10 styles, published tempi from the
// GTZAN-Rhythm annotations, Marchand & Peeters 2015), all of them. Cross-validated figures (leave one style
// out): `npm run eval:tempo -- --real`. Features, in order:
// logTempo, logTempoSquared, comb, pulse, bassPulse, subdivision, beatsPerOnset, beatsPerOnsetSquared.
import type { LevelModel } from './level';

export const LEVEL_MODEL: LevelModel = {
  weights: [0.1464, -1.2178, 1.0988, 0.9786, 0.1434, 0.5266, 0.1374, -0.3123],
  mean: [-0.3966, 0.7175, 0.7536, 0.7363, 0.7856, 0.7729, -2.091, 5.0087],
  scale: [0.7485, 0.7257, 0.1841, 0.2347, 0.2049, 0.3301, 0.7977, 3.3138],
};
