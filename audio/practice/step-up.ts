// Step-up practice on a looped passage: start slow, play the passage a set number of clean times at each
// tempo, then raise the tempo by a step, until the goal is reached. Pure state; the player feeds it passes.
import { plural, tenth } from '@/shared/format';

export interface StepUpPlan {
  startBpm: number;
  stepBpm: number;
  /** Clean repetitions needed at a tempo before it goes up. */
  repsPerStep: number;
  goalBpm: number;
}

export interface StepUpState {
  plan: StepUpPlan;
  /** Tempo being played now. */
  bpm: number;
  /** Clean repetitions at the current tempo. */
  cleanAtTempo: number;
  /** Every repetition played, clean or not. */
  repetitions: number;
  /** The highest tempo at which a full set was played clean (null before the first set). */
  reachedBpm: number | null;
  done: boolean;
}

/** A run longer than this is a typing slip (a step of 0.1 BPM, say), not a practice plan. */
const MAX_STEPS = 60;

export function validatePlan(p: StepUpPlan): string | null {
  if (!(p.startBpm > 0 && p.goalBpm > 0)) return 'start and goal tempos are needed';
  if (p.goalBpm < p.startBpm) return 'the goal must not be below the start tempo';
  if (!(p.stepBpm > 0)) return 'the step must be more than 0 BPM';
  if (!(Number.isInteger(p.repsPerStep) && p.repsPerStep >= 1))
    return 'repetitions per step must be a whole number, at least 1';
  if (p.repsPerStep > 100) return 'at most 100 repetitions per step';
  if ((p.goalBpm - p.startBpm) / p.stepBpm > MAX_STEPS)
    return `that is more than ${plural(MAX_STEPS, 'step')}: take a larger step`;
  return null;
}

export function startStepUp(plan: StepUpPlan): StepUpState {
  const problem = validatePlan(plan);
  if (problem) throw new RangeError(problem);
  return { plan, bpm: plan.startBpm, cleanAtTempo: 0, repetitions: 0, reachedBpm: null, done: false };
}

/**
 * One pass through the loop has ended. A clean pass counts toward the set; after a full set the tempo goes up
 * one step (never past the goal); a full set at the goal ends the run.
 */
export function passFinished(s: StepUpState, clean: boolean): StepUpState {
  if (s.done) return s;
  const repetitions = s.repetitions + 1;
  const cleanAtTempo = s.cleanAtTempo + (clean ? 1 : 0);
  if (cleanAtTempo < s.plan.repsPerStep) return { ...s, repetitions, cleanAtTempo };
  const reachedBpm = s.bpm;
  if (s.bpm >= s.plan.goalBpm - 1e-9) return { ...s, repetitions, cleanAtTempo, reachedBpm, done: true };
  const bpm = Math.min(s.plan.goalBpm, tenth(s.bpm + s.plan.stepBpm));
  return { ...s, repetitions, cleanAtTempo: 0, reachedBpm, bpm };
}

/** The tempos the plan will visit, start to goal. */
export function stepUpTempos(plan: StepUpPlan): number[] {
  const out: number[] = [];
  let s = startStepUp(plan);
  out.push(s.bpm);
  while (!s.done) {
    for (let i = 0; i < plan.repsPerStep && !s.done; i++) s = passFinished(s, true);
    if (!s.done) out.push(s.bpm);
  }
  return out;
}
