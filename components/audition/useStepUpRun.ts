// A step-up run on the looped passage (audio/practice/step-up.ts): the player reports each pass through the
// loop, the run raises the tempo after each clean set, and when it ends (goal reached, ended by hand, or the
// passage changed) what was played is written to the song's practice log. A run that played a full set clean
// above the working tempo then offers to raise it (the song's, or the saved passage's).
import { useEffect, useRef, useState } from 'react';
import { MAX_SPEED, MIN_SPEED } from '@/client/player';
import { logPractice, useMe } from '@/client/hooks';
import { offerAfter, type Offer } from '@/components/RaiseOffer';
import { barsOf, describePassage, type Passage } from '@/audio/practice/passage';
import { passFinished, startStepUp, type StepUpPlan, type StepUpState } from '@/audio/practice/step-up';
import { formatBpm, plural, tenth } from '@/shared/format';
import type { Passage as SavedPassage, PracticeInput, Song } from '@/shared/schemas';
import type { AuditionPlayerState } from './useAuditionPlayer';

// The plan offered before the player changes it (each field can be edited before the run starts).
/** Without a working tempo a run starts at 70 % of the recording's: slow enough to play a hard passage clean,
 * near enough to keep its character (the usual advice for slow practice; from memory). */
const DEFAULT_START_SHARE = 0.7;
/** A step of 4 BPM after three clean passes: about one mark of the metronome scale at a time, each tempo
 * played clean more than once before it goes up (the usual step-up drill; from memory). */
const DEFAULT_STEP_BPM = 4;
const DEFAULT_REPS_PER_STEP = 3;

/** What a practice entry on `loop` refers to: the saved passage it is, or the recording's region and its bars. */
export function entryRegion(
  loop: Passage,
  recordingId: string,
  downbeats: number[],
  saved: SavedPassage | null,
): Partial<PracticeInput> {
  if (saved) return { passageId: saved.id };
  return { recordingId, startSec: loop.start, endSec: loop.end, ...barsOf(loop, downbeats) };
}

export function useStepUpRun({
  audition,
  song,
  recordingId,
  saved,
  canLog,
  downbeats,
  originalBpm,
}: {
  audition: AuditionPlayerState;
  song: Song | undefined;
  recordingId: string;
  /** The saved passage the loop is, if it is one: the entry refers to it and its tempos start the plan. */
  saved: SavedPassage | null;
  /** Only the song's owner writes its practice log. */
  canLog: boolean;
  downbeats: number[];
  originalBpm: number;
}) {
  const { onLoopPassRef, loop, bpm, setBpm, seek, play, pause, setFailure } = audition;
  const [stepUp, setStepUp] = useState<StepUpState | null>(null);
  const [logged, setLogged] = useState<string | null>(null);
  const [offer, setOffer] = useState<Offer | null>(null);
  const { me } = useMe();
  const run = useRef<{ state: StepUpState; notClean: boolean; startedAt: number } | null>(null);

  const finish = async (s: StepUpState) => {
    const r = run.current;
    run.current = null;
    if (!r || s.repetitions === 0 || !song) return;
    const minutes = tenth((Date.now() - r.startedAt) / 60000);
    const passage = saved?.name ?? (loop ? describePassage(loop, downbeats) : null);
    const region = loop ? entryRegion(loop, recordingId, downbeats, saved) : {};
    const reached = s.reachedBpm ?? s.plan.startBpm;
    if (!canLog) return;
    try {
      const entry = await logPractice(song.id, {
        ...region,
        passage,
        startBpm: s.plan.startBpm,
        reachedBpm: reached,
        repetitions: s.repetitions,
        minutes,
        // The reached tempo is the last one played as a full clean set; before the first set there is none.
        clean: s.reachedBpm !== null,
      });
      setOffer(offerAfter(entry, song, saved ? [saved] : [], me?.id));
      setLogged(
        `Logged: ${passage ?? 'the recording'}, ${formatBpm(s.plan.startBpm)} → ${formatBpm(reached)} BPM, ${plural(s.repetitions, 'repetition')}, ${minutes} min.`,
      );
    } catch (e) {
      setLogged(null);
      setFailure(`The practice entry was not saved: ${(e as Error).message}`);
    }
  };

  // Each render hands the player a listener that sees this render's tempo and passage.
  useEffect(() => {
    onLoopPassRef.current = () => {
      const r = run.current;
      if (!r) return;
      const next = passFinished(r.state, !r.notClean);
      r.state = next;
      r.notClean = false;
      setStepUp(next);
      if (next.done) {
        pause();
        void finish(next);
      } else if (next.bpm !== bpm) setBpm(next.bpm);
    };
  });

  const start = (plan: StepUpPlan) => {
    const s = startStepUp(plan);
    run.current = { state: s, notClean: false, startedAt: Date.now() };
    setStepUp(s);
    setLogged(null);
    setOffer(null);
    setBpm(s.bpm);
    if (loop) seek(loop.start);
    play();
  };

  const end = () => {
    const s = run.current?.state;
    pause();
    if (s) void finish(s);
    setStepUp(null);
  };

  /** A new passage (or none) ends a run on the old one; what was played is logged. */
  const changePassage = (p: Passage | null) => {
    if (run.current) void finish(run.current.state);
    setStepUp(null);
    audition.setLoop(p);
  };

  const defaultPlan: StepUpPlan = {
    startBpm: tenth(
      Math.max(originalBpm * MIN_SPEED, saved?.workingBpm ?? song?.workingBpm ?? originalBpm * DEFAULT_START_SHARE),
    ),
    stepBpm: DEFAULT_STEP_BPM,
    repsPerStep: DEFAULT_REPS_PER_STEP,
    goalBpm: tenth(Math.min(originalBpm * MAX_SPEED, saved?.goalBpm ?? song?.goalBpm ?? originalBpm)),
  };

  return {
    stepUp,
    logged,
    /** The raise of the working tempo the last run earned, if any. */
    offer,
    dismissOffer: () => setOffer(null),
    defaultPlan,
    start,
    end,
    changePassage,
    /** The pass being played was not clean: it will not count toward the set. */
    notClean: () => {
      if (run.current) run.current.notClean = true;
    },
  };
}
