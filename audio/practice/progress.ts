// What a logged session does for the working tempo: a clean session above it offers to raise it. The player
// decides (one tap, undoable); nothing moves the working tempo by itself.
import { tenth } from '@/shared/format';

export interface SessionResult {
  /** The reached tempo was played clean (for a step-up run: a full set of clean passes at it). */
  clean: boolean;
  reachedBpm: number;
}

export interface TemposNow {
  workingBpm: number | null;
  goalBpm: number | null;
}

/**
 * The working tempo to offer after a session, or null when there is nothing to offer: the session was not
 * clean, or it was not faster than the working tempo already is. The offer never passes the goal: a working
 * tempo above the goal would leave the progress bar past its end.
 */
export function raiseOffer(session: SessionResult, now: TemposNow): number | null {
  if (!session.clean) return null;
  const target = tenth(now.goalBpm === null ? session.reachedBpm : Math.min(session.reachedBpm, now.goalBpm));
  if (now.workingBpm !== null && target <= now.workingBpm) return null;
  return target;
}
