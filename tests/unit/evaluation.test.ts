// The evaluation measures against outside truth: mir_eval's own test vectors (read from ../shared beside the
// checkout, not copied: see ../shared/reference-data/README.md for their source and licence) and the
// definitions of Accuracy1/2 in Gouyon et al. 2006 (IEEE TASLP 14(5), section III).
import fs from 'node:fs';
import path from 'node:path';
import {
  accuracy1,
  accuracy2,
  beatFMeasure,
  beatPScore,
  matchEvents,
  tempoDetection,
  trimBeats,
} from '@/audio/analysis/evaluation';
import { describeWithReferenceData, REFERENCE_DATA as REF } from '@/tests/reference-data';

const numbers = (file: string) =>
  fs
    .readFileSync(file, 'utf8')
    .split('\n')
    .filter((l) => l.trim() && !l.trim().startsWith('#'))
    .flatMap((l) => l.trim().split(/\s+/).map(Number));

describeWithReferenceData(
  'beat measures against mir_eval test vectors (craffel/mir_eval tests/data/beat, via ../shared)',
  () => {
    test.each(['00', '01', '02', '03'])('pair %s', (id) => {
      const dir = path.join(REF, 'mir_eval-beat');
      const expected = JSON.parse(fs.readFileSync(path.join(dir, `output${id}.json`), 'utf8'));
      // mir_eval.beat.evaluate trims beats before 5 s from both lists before scoring.
      const ref = trimBeats(numbers(path.join(dir, `ref${id}.txt`)));
      const est = trimBeats(numbers(path.join(dir, `est${id}.txt`)));
      expect(beatFMeasure(ref, est)).toBeCloseTo(expected['F-measure'], 10);
      expect(beatPScore(ref, est)).toBeCloseTo(expected['P-score'], 10);
    });
  },
);

describeWithReferenceData('tempo detection against mir_eval test vectors (tests/data/tempo, via ../shared)', () => {
  const dir = path.join(REF, 'mir_eval-tempo');
  test.each(['00', '01', '02', '03'])('pair %s', (id) => {
    const [r1, r2, weight] = numbers(path.join(dir, `ref${id}.lab`));
    const [e1, e2] = numbers(path.join(dir, `est${id}.lab`));
    const expected = JSON.parse(fs.readFileSync(path.join(dir, `output${id}.json`), 'utf8'));
    const got = tempoDetection([r1!, r2!], weight!, [e1!, e2!]);
    expect(got.pScore).toBeCloseTo(expected['P-score'], 12);
    expect(got.oneCorrect).toBe(expected['One-correct']);
    expect(got.bothCorrect).toBe(expected['Both-correct']);
  });

  test('the inputs mir_eval rejects are rejected (bad01: negative weight, bad02: negative tempo)', () => {
    const [r1, r2, w] = numbers(path.join(dir, 'bad01.lab'));
    expect(() => tempoDetection([r1!, r2!], w!, [60, 120])).toThrow(RangeError);
    const [s1, s2, v] = numbers(path.join(dir, 'bad02.lab'));
    expect(() => tempoDetection([s1!, s2!], v!, [60, 120])).toThrow(RangeError);
  });
});

describe('Accuracy1 and Accuracy2 (Gouyon et al. 2006: 4 % tolerance; Accuracy2 also at ×2, ×3, ×1/2, ×1/3)', () => {
  test.each([
    // [estimate, reference, accuracy1, accuracy2]
    [120, 120, true, true],
    [124.8, 120, true, true], // +4 %: at the edge, counted
    [125, 120, false, false], // +4.17 %
    [60, 120, false, true], // half
    [240, 120, false, true], // double
    [40, 120, false, true], // a third
    [360, 120, false, true], // triple
    [180, 120, false, false], // 3/2 is not among Accuracy2's factors
    [80, 120, false, false], // 2/3 neither
  ])('estimate %p against %p → A1 %p, A2 %p', (est, ref, a1, a2) => {
    expect(accuracy1(est, ref)).toBe(a1);
    expect(accuracy2(est, ref)).toBe(a2);
  });
});

describe('event matching', () => {
  test('each reference beat takes at most one estimate (worked example, by construction)', () => {
    // Two estimates near one reference beat: only one can match; the third estimate is 80 ms off (> 70 ms).
    expect(matchEvents([1.0, 2.0], [0.98, 1.03, 2.08], 0.07)).toBe(1);
    expect(beatFMeasure([1.0, 2.0], [0.98, 1.03, 2.08])).toBeCloseTo((2 * (1 / 3) * (1 / 2)) / (1 / 3 + 1 / 2), 12);
  });
});
