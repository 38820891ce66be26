// Play-along feedback, beat by beat: how far each onset lands from its click, the running tempo of the last
// eight beats against the target, and whether the player is steady, rushing or dragging. Pure: fed onset
// times (context seconds, already shifted by the measured latency) and the click grid.

/** The click grid of a run: beat 0 sounds at `start`, then one every 60 / bpm seconds. */
export interface ClickGrid {
  start: number;
  bpm: number;
}

export type PlayState = 'steady' | 'rushing' | 'dragging';

/** One onset placed against its click. */
export interface BeatMark {
  /** The beat of the grid the onset belongs to (the nearest click). */
  beat: number;
  /** The onset's context time. */
  time: number;
  /** Onset minus click, in ms: negative is early (ahead of the click), positive late. */
  offsetMs: number;
  /** Tempo of the last (up to) eight beat-to-beat intervals played; null until two beats are in. */
  bpm: number | null;
  state: PlayState;
}

/**
 * An onset further than this from its click reads as ahead or behind. Players in an ensemble are typically
 * 30–50 ms apart at note onsets (Rasch, "Synchronization in performed ensemble music", Acustica 43, 1979; from
 * memory); 25 ms keeps the live view from calling a good beat off while still flagging a clearly early one.
 */
export const OFFSET_TOLERANCE_MS = 25;
/**
 * The running tempo counts as off when it is more than this far from the target: about the smallest tempo
 * change listeners notice in a steady pulse (Drake & Botte, "Tempo sensitivity in auditory sequences",
 * Perception & Psychophysics 54, 1993, report roughly 2–3 %; from memory).
 */
export const TEMPO_TOLERANCE_PCT = 2.5;
/** The running tempo spans this many beat-to-beat intervals (the "last eight beats"). */
export const RUNNING_INTERVALS = 8;

/** The nearest click to `time`: its beat number (never before beat 0) and the offset in ms. */
export function nearestClick(time: number, grid: ClickGrid): { beat: number; offsetMs: number } {
  const period = 60 / grid.bpm;
  const beat = Math.max(0, Math.round((time - grid.start) / period));
  return { beat, offsetMs: (time - (grid.start + beat * period)) * 1000 };
}

/**
 * Tempo of the last `RUNNING_INTERVALS` beats played: beats between the first and last of the window over the
 * time between them (a beat left out by the player does not halve the figure).
 */
export function runningTempo(marks: Pick<BeatMark, 'beat' | 'time'>[]): number | null {
  if (marks.length < 2) return null;
  const last = marks[marks.length - 1]!;
  let first = marks[marks.length - 2]!;
  for (let i = marks.length - 2; i >= 0 && last.beat - marks[i]!.beat <= RUNNING_INTERVALS; i--) first = marks[i]!;
  const beats = last.beat - first.beat;
  const span = last.time - first.time;
  return beats > 0 && span > 0 ? (60 * beats) / span : null;
}

/**
 * Steady, rushing or dragging, decided at every beat so it changes within one beat: the latest onset's offset
 * first (an early or late beat shows at once), then the running tempo against the target (a gradual drift the
 * offsets alone would show only later).
 */
export function playState(offsetMs: number, bpm: number | null, targetBpm: number): PlayState {
  if (offsetMs < -OFFSET_TOLERANCE_MS) return 'rushing';
  if (offsetMs > OFFSET_TOLERANCE_MS) return 'dragging';
  if (bpm !== null) {
    const pct = ((bpm - targetBpm) / targetBpm) * 100;
    if (pct > TEMPO_TOLERANCE_PCT) return 'rushing';
    if (pct < -TEMPO_TOLERANCE_PCT) return 'dragging';
  }
  return 'steady';
}

/** The feedback of one run: onsets in, one mark per beat out (a second onset on a beat, e.g. a fill, is left out). */
export class LiveFeedback {
  readonly marks: BeatMark[] = [];

  constructor(
    readonly grid: ClickGrid,
    /** Beats before this one (the count-in) get no mark. */
    private readonly firstBeat = 0,
  ) {}

  /** An onset at context time `time`; returns its mark, or null when it is not a new beat. */
  add(time: number): BeatMark | null {
    const { beat, offsetMs } = nearestClick(time, this.grid);
    if (beat < this.firstBeat) return null;
    const prev = this.marks[this.marks.length - 1];
    if (prev && beat <= prev.beat) return null;
    const window = [...this.marks.slice(-RUNNING_INTERVALS), { beat, time }];
    const bpm = runningTempo(window);
    const mark: BeatMark = { beat, time, offsetMs, bpm, state: playState(offsetMs, bpm, this.grid.bpm) };
    this.marks.push(mark);
    return mark;
  }
}
