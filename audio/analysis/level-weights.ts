// Written by `npm run train:level` (fixtures/train-level.ts): the metrical-level model fitted on the 70
// GTZAN clips of ../shared/reference-data/real-recordings (10 styles, published tempi from the
// GTZAN-Rhythm annotations, Marchand & Peeters 2015), all of them. Cross-validated figures (leave one style
// out): `npm run eval:tempo -- --real`. Features, in order:
// logTempo, logTempoSquared, comb, pulse, bassPulse, subdivision, beatsPerOnset, beatsPerOnsetSquared, backbeat.
import type { LevelModel } from './level';

export const LEVEL_MODEL: LevelModel = {
  weights: [0.1469, -1.1692, 0.9612, 0.8079, 0.1336, 0.4896, 0.1378, -0.3236, 0.7386],
  mean: [-0.3966, 0.7175, 0.7536, 0.7363, 0.7856, 0.7729, -2.091, 5.0087, 0.7773],
  scale: [0.7485, 0.7257, 0.1841, 0.2347, 0.2049, 0.3301, 0.7977, 3.3138, 0.2037],
};
