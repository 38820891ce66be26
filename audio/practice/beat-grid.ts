// The beat the player feels, applied to the engine's grid: the metrical level (half the beats, as found, or a
// beat inserted between each pair), the beat the player calls one, and a nudge of every time. Pure functions:
// the recording keeps the player's choices (beatLevel, barOneSec, nudgeMs) and the player and waveform draw the
// grid these return.
export type BeatLevel = 'half' | 'as-found' | 'double';

/** How the felt tempo relates to the one found, per level. */
export const LEVEL_FACTOR: Record<BeatLevel, number> = { half: 0.5, 'as-found': 1, double: 2 };

/**
 * How many beats the player feels in a recording: the engine's count, scaled by a tempo the player corrected by
 * hand (the recording holds that many beats a minute, not the engine's) and by the level. At its own felt tempo
 * the recording then lasts exactly as long as it does.
 */
export function feltBeatCount(
  beatCount: number,
  foundBpm: number | null,
  correctedBpm: number | null,
  level: BeatLevel,
): number {
  const corrected = correctedBpm && foundBpm ? correctedBpm / foundBpm : 1;
  return beatCount * corrected * LEVEL_FACTOR[level];
}

export interface FeltChoices {
  beatLevel: BeatLevel;
  /** The time of the beat the player calls one; null = bar 1 as the engine found it. */
  barOneSec: number | null;
  nudgeMs: number;
}

export interface FeltGrid {
  beats: number[];
  downbeats: number[];
  /** The tempo at the felt level (the found tempo × the level's factor). */
  bpm: number;
}

/** Index of the time in `xs` nearest `t` (−1 for none). */
export function nearestIndex(xs: number[], t: number): number {
  let best = -1;
  for (let i = 0; i < xs.length; i++) if (best < 0 || Math.abs(xs[i]! - t) < Math.abs(xs[best]! - t)) best = i;
  return best;
}

/**
 * The beats at a metrical level. Half: every other beat, keeping the one nearest `one` (so the beat called one
 * stays a beat); double: a beat inserted halfway between each pair.
 */
export function beatsAtLevel(beats: number[], level: BeatLevel, one: number): number[] {
  if (level === 'as-found' || beats.length < 2) return beats.slice();
  if (level === 'half') {
    const parity = Math.max(0, nearestIndex(beats, one)) % 2;
    return beats.filter((_, i) => i % 2 === parity);
  }
  const out: number[] = [];
  for (let i = 0; i < beats.length; i++) {
    out.push(beats[i]!);
    if (i + 1 < beats.length) out.push((beats[i]! + beats[i + 1]!) / 2);
  }
  return out;
}

/** Bar starts counted from the beat nearest `one`, every `perBar` beats, both ways. */
export function downbeatsFrom(beats: number[], one: number, perBar: number): number[] {
  const i0 = nearestIndex(beats, one);
  if (i0 < 0 || perBar < 1) return [];
  return beats.filter((_, i) => (((i - i0) % perBar) + perBar) % perBar === 0);
}

/** Every time moved by `ms` milliseconds (positive = later), kept at or after 0. */
export const nudged = (times: number[], ms: number) =>
  ms === 0 ? times.slice() : times.map((t) => Math.max(0, t + ms / 1000));

/**
 * The grid as the player feels it. With nothing changed it is the engine's grid exactly (its downbeats too,
 * which need not be regular); a level or a beat called one recounts the bars from that beat.
 */
export function feltGrid(
  found: { beats: number[]; downbeats: number[]; bpm: number },
  choices: FeltChoices,
  perBar: number,
): FeltGrid {
  const bpm = found.bpm * LEVEL_FACTOR[choices.beatLevel];
  const asFound = choices.beatLevel === 'as-found' && choices.barOneSec === null;
  const one = choices.barOneSec ?? found.downbeats[0] ?? found.beats[0] ?? 0;
  const beats = beatsAtLevel(found.beats, choices.beatLevel, one);
  const downbeats = asFound ? found.downbeats.slice() : downbeatsFrom(beats, one, perBar);
  return { beats: nudged(beats, choices.nudgeMs), downbeats: nudged(downbeats, choices.nudgeMs), bpm };
}

/** The relation of a tempo to the one found, in plain words ("half", "one and a half times"); null if none. */
export function relationInWords(ratio: number): string | null {
  const named: [number, string][] = [
    [0.25, 'a quarter'],
    [1 / 3, 'a third'],
    [0.5, 'half'],
    [2 / 3, 'two thirds'],
    [0.75, 'three quarters'],
    [1, 'the same'],
    [4 / 3, 'one and a third times'],
    [1.5, 'one and a half times'],
    [2, 'twice'],
    [3, 'three times'],
    [4, 'four times'],
  ];
  // Within 3 %: tempo estimates of related levels agree that closely on a steady recording (from memory).
  const hit = named.find(([r]) => Math.abs(ratio / r - 1) < 0.03);
  return hit ? hit[1] : null;
}
