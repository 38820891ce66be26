// Written by `npm run train:level` (fixtures/train-level.ts): the metrical-level model fitted on the 70
// GTZAN clips of ../shared/reference-data/real-recordings (10 styles, published tempi from the
// GTZAN-Rhythm annotations, Marchand & Peeters 2015), all of them. Cross-validated figures (leave one style
// out): `npm run eval:tempo -- --real`. Features, in order:
// logTempo, logTempoSquared, comb, pulse, bassPulse, subdivision, beatsPerOnset, beatsPerOnsetSquared, backbeat.
import type { LevelModel } from './level';

export const LEVEL_MODEL: LevelModel = {
  weights: [0.1675, -1.0753, 1.393, 0.43, -0.1105, 0.2098, 0.1584, -0.2251, 0.829],
  mean: [-0.3919, 0.6826, 0.7684, 0.7589, 0.8122, 0.8022, -2.0942, 4.9769, 0.7869],
  scale: [0.7273, 0.7075, 0.1721, 0.2131, 0.1822, 0.3251, 0.769, 3.2033, 0.1961],
};
