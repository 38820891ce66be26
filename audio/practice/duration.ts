// How long a piece lasts at a tempo, and the tempo that makes it last a given time: for playing to a picture
// or a fixed slot, and for set lists. Plain arithmetic on beats: a beat at B BPM lasts 60 / B seconds.
import { beatsPerBar } from '@/audio/playback/click';

/**
 * Which note the BPM counts in a meter. `felt`: the beat players feel (dotted quarters in 6/8, 9/8 and 12/8;
 * the top number otherwise: common practice). `written`: every note of the lower number (six eighths in 6/8,
 * seven in 7/8).
 */
export type BeatUnit = 'felt' | 'written';

/** Beats in one bar of `meter`, counting `unit`. */
export function beatsInBar(meter: string, unit: BeatUnit = 'felt'): number {
  if (unit === 'felt') return beatsPerBar(meter);
  const m = /^(\d+)\/(\d+)$/.exec(meter);
  return m ? Number(m[1]) : 4;
}

/** The note the BPM counts, in words, e.g. "dotted quarter" in 6/8 felt in two. */
export function beatName(meter: string, unit: BeatUnit = 'felt'): string {
  const m = /^(\d+)\/(\d+)$/.exec(meter);
  const lower = m ? Number(m[2]) : 4;
  const names: Record<number, string> = { 2: 'half note', 4: 'quarter note', 8: 'eighth note', 16: 'sixteenth note' };
  const compound = unit === 'felt' && beatsInBar(meter, 'felt') !== beatsInBar(meter, 'written');
  if (compound && lower === 8) return 'dotted quarter note';
  if (compound && lower === 16) return 'dotted eighth note';
  return names[lower] ?? 'beat';
}

/** Seconds that `beats` beats last at `bpm`. */
export const secondsFor = (beats: number, bpm: number) => (beats * 60) / bpm;

/** The tempo at which `beats` beats last `seconds`. */
export const bpmToFit = (beats: number, seconds: number) => (beats * 60) / seconds;

/** How many bars of `beatsPerBarCount` beats fit in `seconds` at `bpm`. */
export const barsIn = (seconds: number, bpm: number, beatsPerBarCount: number) =>
  (seconds * bpm) / 60 / beatsPerBarCount;
