// The engine on real recordings: the 70 GTZAN clips beside this clone (../shared/reference-data/
// real-recordings, published tempi and beats from the GTZAN-Rhythm annotations, Marchand & Peeters 2015),
// scored as that folder's README says (Accuracy1/2 within 4 %, Gouyon et al. 2006; mir_eval beat F-measure
// ±70 ms, Raffel et al. 2014), with the metrical-level model cross-validated leave one style out (fitted on
// nine styles, scored on the tenth). The floors are the cross-validated figures reported for this engine
// version (`npm run eval:tempo -- --real`, README): a change that loses ground fails here.
import fs from 'node:fs';
import path from 'node:path';
import { oursCrossValidated, realClips, scoreReal, totals, type RealTotals } from '@/fixtures/real-recordings';

const REF = path.resolve(__dirname, '../../../shared/reference-data');
const hasRef = fs.existsSync(REF);

/** Reported for ENGINE_VERSION 5 (cross-validated, all 70 clips; README). */
const REPORTED = { accuracy1: 81.4, accuracy2: 97.1, beatF: 0.87 };

(hasRef ? describe : describe.skip)(
  'real recordings, cross-validated (skipped: ../shared/reference-data is not beside this clone)',
  () => {
    let t: RealTotals;
    beforeAll(async () => {
      const clips = realClips();
      const results = await oursCrossValidated(clips);
      t = totals(clips.map((c, i) => scoreReal(c, results[i]!)));
    }, 300_000);

    test('every clip is scored', () => {
      expect(t.clips).toBe(70);
    });
    test(`Accuracy1 at or above the reported ${REPORTED.accuracy1} %`, () => {
      expect(t.accuracy1).toBeGreaterThanOrEqual(REPORTED.accuracy1);
    });
    test(`Accuracy2 at or above the reported ${REPORTED.accuracy2} %`, () => {
      expect(t.accuracy2).toBeGreaterThanOrEqual(REPORTED.accuracy2);
    });
    test(`beat F-measure at or above the reported ${REPORTED.beatF}`, () => {
      expect(t.beatF).toBeGreaterThanOrEqual(REPORTED.beatF);
    });
  },
);
