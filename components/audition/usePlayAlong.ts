// Play along with the reference at the tempo chosen on the player, with live feedback: the microphone goes into
// the capture worklet on the page's one AudioContext (client/live-session.ts) while the reference plays, and each
// onset is placed against the reference's beats as the player hears them — a grid learnt a little ahead from
// the player (`beatTimes`), forgotten and learnt anew whenever the timeline changes (a tempo change heard, a
// pause, a corrected grid), so loops and tempo changes are followed. What was played is recorded in the
// browser and offered at the end to keep (a take of the song) or discard; only a kept take leaves the browser.
import { useCallback, useEffect, useRef, useState } from 'react';
import type { AuditionPlayer } from '@/client/player';
import { ReferenceGrid, type BeatMark } from '@/audio/live/feedback';
import { barAt, beatInBar } from '@/audio/practice/passage';
import { endRun, LiveSession, type RecordedTake } from '@/client/live-session';
import { readCalibration } from '@/client/latency';
import { audioContext } from '@/client/audio-context';
import type { BeatPlace } from '@/components/LiveBeatView';
import type { AuditionPlayerState } from './useAuditionPlayer';

/** Beats are learnt this far ahead of now: more than half a beat at the slowest tempo (30 BPM), so an early
 * onset always finds the beat it anticipates. */
const LOOKAHEAD_SEC = 1.5;
/** How often the grid is extended: a fraction of the lookahead, so it never runs dry. */
const REFRESH_MS = 100;

export type PlayAlongPhase = 'idle' | 'starting' | 'running' | 'review';

export function usePlayAlong(audition: AuditionPlayerState) {
  const [phase, setPhase] = useState<PlayAlongPhase>('idle');
  const [error, setError] = useState<string | null>(null);
  const [level, setLevel] = useState(0);
  const [marks, setMarks] = useState<BeatMark[]>([]);
  const [take, setTake] = useState<RecordedTake | null>(null);
  const [note, setNote] = useState<string | null>(null);
  const session = useRef<LiveSession | null>(null);
  const grid = useRef(new ReferenceGrid<BeatPlace>());
  const timer = useRef<ReturnType<typeof setInterval> | null>(null);
  const latencyMs = readCalibration()?.latencyMs ?? null;

  /** The player this run follows. */
  const following = useRef<AuditionPlayer | null>(null);

  const release = useCallback(() => {
    if (timer.current) clearInterval(timer.current);
    timer.current = null;
    following.current?.followTimeline(null);
    following.current = null;
    session.current?.dispose();
    session.current = null;
    setLevel(0);
  }, []);

  /** The run ends (Stop, Pause, the recording's end): the take played is offered to keep or discard. */
  const finish = useCallback(async () => {
    const s = session.current;
    // Stop and the music ending may both ask: the first one finishes the run.
    if (!s) return;
    session.current = null;
    const end = await endRun(s);
    release();
    setTake(end.take);
    setNote(end.note);
    setPhase(end.take ? 'review' : 'idle');
  }, [release]);

  const stop = useCallback(() => {
    if (timer.current) clearInterval(timer.current);
    timer.current = null;
    audition.pause();
    void finish();
  }, [audition, finish]);

  /** Kept or discarded: the card is ready for another run. */
  const done = useCallback((words: string | null) => {
    setTake(null);
    setPhase('idle');
    setNote(words);
  }, []);

  const start = async () => {
    const p = audition.player.current;
    if (!p || !audition.ready || phase !== 'idle') return;
    setError(null);
    setNote(null);
    setMarks([]);
    audition.pause();
    const g = new ReferenceGrid<BeatPlace>();
    grid.current = g;
    // The reference's beats a little ahead of now, each with its bar and beat as the player counts them.
    const learn = () => {
      if (!p.playing) return;
      const now = audioContext().currentTime;
      const { beats, downbeats } = p.beatGrid;
      g.extend(
        p.beatTimes(Math.max(g.knownUntil + 1e-6, now - LOOKAHEAD_SEC), now + LOOKAHEAD_SEC).map((c) => {
          const at = beats[c.beat] ?? 0;
          return { time: c.time, label: { bar: barAt(at, downbeats), beat: beatInBar(at, beats, downbeats) } };
        }),
      );
    };
    following.current = p;
    p.followTimeline((at) => {
      g.dropFrom(at);
      learn();
    });
    const s = new LiveSession({ level: setLevel, mark: (m) => setMarks((ms) => [...ms, m]) });
    session.current = s;
    setPhase('starting');
    try {
      const at = await s.startAlong(g, (latencyMs ?? 0) / 1000);
      if (at === null) return;
      await audition.playAt(at);
      learn();
      timer.current = setInterval(() => {
        // The music stopped (Pause, the recording's end): the run ends with it and the microphone is released.
        if (!p.playing) {
          if (timer.current) clearInterval(timer.current);
          timer.current = null;
          void finish();
        } else learn();
      }, REFRESH_MS);
      setPhase('running');
    } catch (e) {
      release();
      setPhase('idle');
      setError((e as Error).message);
    }
  };

  useEffect(() => () => release(), [release]);

  const placeOf = useCallback((m: BeatMark): BeatPlace => grid.current.labelOf(m.beat) ?? { bar: 0, beat: 0 }, []);

  return { phase, error, note, level, marks, take, start, stop, done, placeOf, latencyMs };
}

export type PlayAlong = ReturnType<typeof usePlayAlong>;
