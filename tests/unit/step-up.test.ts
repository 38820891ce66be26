// Step-up practice as pure state: tempos climb after each set of clean passes up to the goal; plans checked.
import { passFinished, startStepUp, stepUpTempos, validatePlan } from '@/audio/practice/step-up';

describe('step-up practice', () => {
  const plan = { startBpm: 80, stepBpm: 6, repsPerStep: 2, goalBpm: 96 };

  test('the tempos visited run from start to goal by steps, the last step shortened to the goal', () => {
    expect(stepUpTempos(plan)).toEqual([80, 86, 92, 96]);
  });

  test('a pass that was not clean does not count toward the set', () => {
    let s = startStepUp(plan);
    s = passFinished(s, true);
    s = passFinished(s, false);
    expect(s).toMatchObject({ bpm: 80, cleanAtTempo: 1, repetitions: 2, reachedBpm: null });
    s = passFinished(s, true);
    expect(s).toMatchObject({ bpm: 86, cleanAtTempo: 0, repetitions: 3, reachedBpm: 80 });
  });

  test('a full clean set at the goal ends the run; more passes change nothing', () => {
    let s = startStepUp({ startBpm: 100, stepBpm: 10, repsPerStep: 1, goalBpm: 110 });
    s = passFinished(s, true);
    expect(s).toMatchObject({ bpm: 110, done: false, reachedBpm: 100 });
    s = passFinished(s, true);
    expect(s).toMatchObject({ bpm: 110, done: true, reachedBpm: 110, repetitions: 2 });
    expect(passFinished(s, true)).toBe(s);
  });

  test('plans that cannot run are refused with a reason', () => {
    expect(validatePlan({ ...plan, goalBpm: 70 })).toMatch(/goal/);
    expect(validatePlan({ ...plan, stepBpm: 0 })).toMatch(/step/);
    expect(validatePlan({ ...plan, repsPerStep: 1.5 })).toMatch(/whole number/);
    expect(validatePlan({ startBpm: 40, stepBpm: 0.1, repsPerStep: 1, goalBpm: 200 })).toMatch(/more than 60 steps/);
    expect(() => startStepUp({ ...plan, goalBpm: 70 })).toThrow(RangeError);
  });
});
