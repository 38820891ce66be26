// The click: where the recording's beats fall in playback time when it plays at another tempo (possibly
// changed part-way), which of them are accented, and the count-in before playback starts.
import { beatsBetween, type Passage } from '@/audio/practice/passage';

/**
 * One stretch of playback at a constant speed: from context time `at` (seconds on the audio clock) the
 * recording is heard from `from` (seconds into the recording) at `speed` × its own tempo.
 */
export interface PlaybackSegment {
  at: number;
  from: number;
  speed: number;
}

/** The playback timeline: segments in time order; a tempo change starts a new one where the old one is. */
export class PlaybackMap {
  private segments: PlaybackSegment[] = [];

  constructor(at: number, from: number, speed: number) {
    this.segments.push({ at, from, speed });
  }

  /** Change speed at context time `at`, keeping the musical position (the same beat keeps playing). */
  changeSpeed(at: number, speed: number) {
    const from = this.recordingTime(at);
    this.segments = this.segments.filter((s) => s.at < at);
    this.segments.push({ at, from, speed });
  }

  /** Take a segment made elsewhere (the audio thread's copy of this timeline), replacing any from its time on. */
  addSegment(seg: PlaybackSegment) {
    this.segments = this.segments.filter((s) => s.at < seg.at);
    this.segments.push({ at: seg.at, from: seg.from, speed: seg.speed });
  }

  private segmentAtContext(t: number): PlaybackSegment {
    let s = this.segments[0]!;
    for (const seg of this.segments) if (seg.at <= t) s = seg;
    return s;
  }

  /** Speed of playback at context time t. */
  speedAt(t: number): number {
    return this.segmentAtContext(t).speed;
  }

  /** Seconds into the recording heard at context time t. */
  recordingTime(t: number): number {
    const s = this.segmentAtContext(t);
    return s.from + (t - s.at) * s.speed;
  }

  /** Context time at which the recording reaches `x` seconds (null if that lies before playback began). */
  contextTime(x: number): number | null {
    for (let i = this.segments.length - 1; i >= 0; i--) {
      const s = this.segments[i]!;
      if (x >= s.from) return s.at + (x - s.from) / s.speed;
    }
    return null;
  }
}

export interface Click {
  /** Context time. */
  time: number;
  accent: boolean;
  /** Index of the beat in the recording's grid (−1 for count-in clicks). */
  beat: number;
  /** For the plain metronome: the beat's place in its bar, 0 for the downbeat. */
  inBar?: number;
}

/**
 * The clicks to schedule between context times [from, to): the recording's beats mapped through the playback.
 * With a loop the map runs on the loop's straight timeline (audio/practice/passage.ts) and the region's beats repeat.
 */
export function clicksBetween(
  map: PlaybackMap,
  beats: number[],
  downbeats: number[],
  from: number,
  to: number,
  loop: Passage | null = null,
): Click[] {
  const out: Click[] = [];
  for (const b of beatsBetween({ beats, downbeats }, loop, map.recordingTime(from) - 1e-6, map.recordingTime(to))) {
    const time = map.contextTime(b.at);
    if (time !== null && time >= from - 1e-9 && time < to) out.push({ time, accent: b.accent, beat: b.index });
  }
  return out;
}

/**
 * One bar of clicks before playback: `beatsPerBar` clicks at the playback tempo, the first accented, ending
 * one beat before `start` (the downbeat where the music comes in).
 */
export function countIn(start: number, beatsPerBar: number, playbackBpm: number): Click[] {
  const beat = 60 / playbackBpm;
  return Array.from({ length: beatsPerBar }, (_, i) => ({
    time: start - (beatsPerBar - i) * beat,
    accent: i === 0,
    beat: -1,
  }));
}

/** Beats per bar of a meter such as "3/4" or "6/8" (6/8 counts its two dotted beats as the click does). */
export function beatsPerBar(meter: string | null): number {
  const m = /^(\d+)\/(\d+)$/.exec(meter ?? '');
  if (!m) return 4;
  const top = Number(m[1]);
  // Compound meters (6/8, 9/8, 12/8) are felt in dotted quarters: common practice.
  return Number(m[2]) === 8 && top % 3 === 0 && top > 3 ? top / 3 : top;
}

/**
 * A plain metronome (click-only mode) on the audio clock. A tempo or meter change takes effect from the next
 * beat, so no beat is dropped or doubled and the bar goes on counting.
 */
export class MetronomeTimeline {
  /** The beat from which the current tempo counts: its context time and its number since the start. */
  private anchor: { at: number; beat: number };

  constructor(
    start: number,
    private bpm: number,
    private perBar: number,
  ) {
    this.anchor = { at: start, beat: 0 };
  }

  private beatTime(k: number) {
    return this.anchor.at + ((k - this.anchor.beat) * 60) / this.bpm;
  }

  /** The first beat at or after context time t. */
  private nextBeat(t: number) {
    return Math.max(this.anchor.beat, Math.ceil(this.anchor.beat + ((t - this.anchor.at) * this.bpm) / 60 - 1e-9));
  }

  /** New tempo and/or meter from the first beat not yet heard at `now` (a beat already scheduled keeps its time). */
  change(now: number, bpm: number, perBar = this.perBar) {
    const k = this.nextBeat(now);
    this.anchor = { at: this.beatTime(k), beat: k };
    this.bpm = bpm;
    // A new meter starts its first bar on that beat.
    if (perBar !== this.perBar) this.barStart = k;
    this.perBar = perBar;
  }

  private barStart = 0;

  /** Clicks in [from, to). */
  clicksBetween(from: number, to: number): Click[] {
    const out: Click[] = [];
    for (let k = this.nextBeat(from); this.beatTime(k) < to; k++) {
      out.push({
        time: this.beatTime(k),
        accent: (k - this.barStart) % this.perBar === 0,
        beat: k,
        inBar: (k - this.barStart) % this.perBar,
      });
    }
    return out;
  }
}
