// Play-along feedback, beat by beat: how far each onset lands from its beat, the running tempo of the last
// eight beats against the target, and whether the player is steady, rushing or dragging. Pure: fed onset
// times (context seconds, already shifted by the measured latency) and a target grid — the plain click at one
// tempo (`steadyGrid`), or the beats of a reference as the player hears them (`ReferenceGrid`: any spacing,
// growing as playback goes on, through loops and tempo changes).

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
  /**
   * The target over the same beats: their count over the time the grid gives them (a reference with rubato is
   * judged against itself); the grid's tempo at that beat until two beats are in.
   */
  targetBpm: number;
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

/** The beats an onset is judged against, numbered 0, 1, 2… in the order they are heard. */
export interface TargetGrid {
  /** The beat nearest to `time`, or null when `time` is not within half a beat of a beat the grid knows. */
  nearest(time: number): { beat: number; time: number } | null;
  /** Context time of beat `beat`, or null when not known. */
  timeOf(beat: number): number | null;
}

/** The plain click: beat 0 at `start`, one every 60 / bpm seconds, never ending. */
export function steadyGrid(grid: ClickGrid): TargetGrid {
  const period = 60 / grid.bpm;
  return {
    nearest: (time) => {
      const { beat } = nearestClick(time, grid);
      return { beat, time: grid.start + beat * period };
    },
    timeOf: (beat) => (beat >= 0 ? grid.start + beat * period : null),
  };
}

/**
 * The beats of a reference as they are heard (context seconds), learnt a little ahead as playback goes on. A
 * loop repeats the passage's beats and a tempo change spaces them anew, so the spacing is anything; a beat is
 * numbered by its place in what was heard, so the running tempo counts the beats played across a loop's wrap.
 */
export class ReferenceGrid<Label = unknown> implements TargetGrid {
  private readonly times: number[] = [];
  private readonly labels: Label[] = [];

  /** Beats heard from `time` on; one at or before the last known is ignored (asked again, it is not doubled). */
  extend(beats: { time: number; label: Label }[]) {
    for (const b of beats) {
      const last = this.times[this.times.length - 1];
      if (last !== undefined && b.time <= last + 1e-6) continue;
      this.times.push(b.time);
      this.labels.push(b.label);
    }
  }

  /** Forgets the beats at or after `time` (the tempo changed or playback stopped there); they are learnt anew. */
  dropFrom(time: number) {
    let n = this.times.length;
    while (n > 0 && this.times[n - 1]! >= time - 1e-6) n--;
    this.times.length = n;
    this.labels.length = n;
  }

  /** Context time up to which beats are known (−Infinity before any). */
  get knownUntil() {
    return this.times[this.times.length - 1] ?? -Infinity;
  }

  get size() {
    return this.times.length;
  }

  timeOf(beat: number) {
    return this.times[beat] ?? null;
  }

  labelOf(beat: number): Label | undefined {
    return this.labels[beat];
  }

  nearest(time: number) {
    const t = this.times;
    if (t.length === 0) return null;
    // The first beat after `time` (binary search), then the closer of it and the one before.
    let lo = 0;
    let hi = t.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (t[mid]! <= time) lo = mid + 1;
      else hi = mid;
    }
    const before = lo - 1;
    const after = lo;
    if (after >= t.length) {
      // After the last known beat: only within half of the last interval (the next beat is not known yet).
      const half = t.length > 1 ? (t[before]! - t[before - 1]!) / 2 : 0;
      return time - t[before]! <= half ? { beat: before, time: t[before]! } : null;
    }
    if (before < 0) {
      // Before the first beat (a count-in, the music's lead-in): only within half of the first interval.
      const half = t.length > 1 ? (t[1]! - t[0]!) / 2 : 0;
      return t[0]! - time <= half ? { beat: 0, time: t[0]! } : null;
    }
    return time - t[before]! <= t[after]! - time
      ? { beat: before, time: t[before]! }
      : { beat: after, time: t[after]! };
  }
}

/** The feedback of one run: onsets in, one mark per beat out (a second onset on a beat, e.g. a fill, is left out). */
export class LiveFeedback {
  readonly marks: BeatMark[] = [];
  private readonly target: TargetGrid;
  /** The plain click's tempo, when the grid is one. */
  private readonly fixedBpm: number | null;

  constructor(
    grid: ClickGrid | TargetGrid,
    /** Beats before this one (the count-in) get no mark. */
    private readonly firstBeat = 0,
  ) {
    const steady = 'bpm' in grid;
    this.target = steady ? steadyGrid(grid) : grid;
    this.fixedBpm = steady ? grid.bpm : null;
  }

  /** An onset at context time `time`; returns its mark, or null when it is not a new beat. */
  add(time: number): BeatMark | null {
    const near = this.target.nearest(time);
    if (!near || near.beat < this.firstBeat) return null;
    const { beat } = near;
    const prev = this.marks[this.marks.length - 1];
    if (prev && beat <= prev.beat) return null;
    const window = [...this.marks.slice(-RUNNING_INTERVALS), { beat, time }];
    const bpm = runningTempo(window);
    const targetBpm = this.targetTempo(window) ?? prev?.targetBpm ?? this.fixedBpm ?? 0;
    const offsetMs = (time - near.time) * 1000;
    const mark: BeatMark = { beat, time, offsetMs, bpm, targetBpm, state: playState(offsetMs, bpm, targetBpm) };
    this.marks.push(mark);
    return mark;
  }

  /**
   * The expected tempo over the beats `runningTempo` spans: the same beats over the grid's time between them.
   * With one beat in, the grid's spacing around it.
   */
  private targetTempo(window: Pick<BeatMark, 'beat'>[]): number | null {
    if (this.fixedBpm !== null) return this.fixedBpm;
    const last = window[window.length - 1]!.beat;
    let first = last;
    for (let i = window.length - 2; i >= 0 && last - window[i]!.beat <= RUNNING_INTERVALS; i--) first = window[i]!.beat;
    const span = first < last ? [first, last] : last > 0 ? [last - 1, last] : [last, last + 1];
    const a = this.target.timeOf(span[0]!);
    const b = this.target.timeOf(span[1]!);
    return a !== null && b !== null && b > a ? (60 * (span[1]! - span[0]!)) / (b - a) : null;
  }
}
