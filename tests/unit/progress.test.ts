// The offer to raise the working tempo after a session (issue: "a clean step-up run or a logged clean session
// above the working tempo offers to raise the working tempo").
import { raiseOffer } from '@/audio/practice/progress';

describe('raising the working tempo is offered', () => {
  test('after a clean session above the working tempo: to the tempo reached', () => {
    expect(raiseOffer({ clean: true, reachedBpm: 96 }, { workingBpm: 90, goalBpm: 112 })).toBe(96);
  });

  test('not after a session that was not clean, however fast', () => {
    expect(raiseOffer({ clean: false, reachedBpm: 104 }, { workingBpm: 90, goalBpm: 112 })).toBeNull();
  });

  test('not when the session was at or below the working tempo', () => {
    expect(raiseOffer({ clean: true, reachedBpm: 88 }, { workingBpm: 90, goalBpm: 112 })).toBeNull();
    expect(raiseOffer({ clean: true, reachedBpm: 90 }, { workingBpm: 90, goalBpm: 112 })).toBeNull();
  });

  test('never past the goal: a clean 118 against a goal of 112 offers 112, and nothing once working is at the goal', () => {
    expect(raiseOffer({ clean: true, reachedBpm: 118 }, { workingBpm: 100, goalBpm: 112 })).toBe(112);
    expect(raiseOffer({ clean: true, reachedBpm: 118 }, { workingBpm: 112, goalBpm: 112 })).toBeNull();
  });

  test('without a working tempo yet, the clean tempo is offered as the first one; tempos kept to a tenth', () => {
    expect(raiseOffer({ clean: true, reachedBpm: 92.46 }, { workingBpm: null, goalBpm: null })).toBe(92.5);
  });
});
