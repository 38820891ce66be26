// Stage 4 — beat times by dynamic programming (Ellis 2007, "Beat Tracking by Dynamic Programming", JNMR
// 36(1)), with the target period taken frame by frame from the tracked tempo path so the grid follows
// tempo changes. Beat positions are then refined to the sub-frame peak of the onset envelope; a grid whose
// off-beats carry the bass is doubled (beatsWithOffBeatBass).

import { parabolicOffset } from './numbers';
import { median } from './curve';

/** Edge beats weaker than this fraction of the median beat strength lie outside the music (half, as before). */
const EDGE_FRACTION = 0.5;
/** Beats in one bar of 4/4 at the slowest: fewer beats than this say nothing about where the bass falls. */
const MIN_BEATS_FOR_OFF_BEATS = 4;
/**
 * A grid is doubled when its bass band accents the points between the beats more than the beats themselves
 * (ratio above 1): the bound says what it means and is not fitted. Fitted on the real recordings it rested
 * on two to four clips (every other clip is read the same either side of 1–1.75) and, with the reggae clips
 * held out, had none to go on and took the highest bound tried (README, engine 5).
 */
export const OFF_BEAT_BASS_DOUBLES = 1;

export interface BeatTrackOptions {
  /** How strongly beat-to-beat intervals are held to the local period (Ellis's α; librosa's 100). */
  tightness?: number;
}

/** Returns beat positions in (fractional) frames. */
export function trackBeats(onset: Float32Array, periodAt: Float32Array, opts: BeatTrackOptions = {}): number[] {
  const n = onset.length;
  if (n === 0) return [];
  const tightness = opts.tightness ?? 100;

  // Normalise by the standard deviation and smooth lightly (librosa's local score).
  let mean = 0;
  for (let i = 0; i < n; i++) mean += onset[i]!;
  mean /= n;
  let sd = 0;
  for (let i = 0; i < n; i++) sd += (onset[i]! - mean) ** 2;
  sd = Math.sqrt(sd / n) || 1;
  const local = new Float32Array(n);
  const sigma = 1.5;
  for (let i = 0; i < n; i++) {
    let acc = 0;
    let wsum = 0;
    for (let d = -4; d <= 4; d++) {
      const j = i + d;
      if (j < 0 || j >= n) continue;
      const w = Math.exp(-0.5 * (d / sigma) ** 2);
      acc += w * onset[j]!;
      wsum += w;
    }
    local[i] = acc / wsum / sd;
  }

  const cum = new Float32Array(n);
  const prev = new Int32Array(n).fill(-1);
  for (let i = 0; i < n; i++) {
    const tau = periodAt[i]!;
    const lo = Math.max(0, Math.floor(i - 2 * tau));
    const hi = Math.floor(i - tau / 2);
    let best = -Infinity;
    let arg = -1;
    for (let p = hi; p >= lo; p--) {
      const l = Math.log((i - p) / tau);
      const s = cum[p]! - tightness * l * l;
      if (s > best) {
        best = s;
        arg = p;
      }
    }
    if (arg >= 0 && best > 0) {
      cum[i] = local[i]! + best;
      prev[i] = arg;
    } else {
      cum[i] = local[i]!;
    }
  }

  // Last beat: the best cumulative score among local maxima within the final period.
  const lastPeriod = Math.ceil(periodAt[n - 1]!);
  let end = n - 1;
  let endScore = -Infinity;
  for (let i = Math.max(0, n - lastPeriod); i < n; i++) {
    if (cum[i]! > endScore) {
      endScore = cum[i]!;
      end = i;
    }
  }
  const frames: number[] = [];
  for (let b = end; b >= 0; b = prev[b]!) frames.push(b);
  frames.reverse();
  return trimWeakEdges(frames, local).map((f) => refinePeak(onset, f));
}

/**
 * Drops leading and trailing beats that fall where there is no music: below half the median beat strength.
 * The median, not the RMS: one outsize onset (a clip cut in mid-sound starts with a burst of flux 20× a
 * beat's) would lift an RMS threshold above every other beat and trim away all but the first few.
 */
function trimWeakEdges(frames: number[], local: Float32Array): number[] {
  if (frames.length < 3) return frames;
  const strengths = frames.map((f) => local[f]!);
  const threshold = EDGE_FRACTION * median(strengths);
  let a = 0;
  let b = frames.length - 1;
  while (a < b && strengths[a]! < threshold) a++;
  while (b > a && strengths[b]! < threshold) b--;
  return frames.slice(a, b + 1);
}

/** The onset peak within ±2 frames of a beat, to a fraction of a frame by parabolic interpolation. */
function refinePeak(onset: Float32Array, f: number): number {
  let best = f;
  for (let d = -2; d <= 2; d++) {
    const j = f + d;
    if (j > 0 && j < onset.length - 1 && onset[j]! > onset[best]!) best = j;
  }
  if (best <= 0 || best >= onset.length - 1 || onset[best]! <= 0) return f;
  return best + parabolicOffset(onset, best);
}

/** The largest envelope value within ±2 frames (the refinement window) of a fractional frame. */
function peakNear(x: Float32Array, f: number): number {
  let m = 0;
  for (let d = -2; d <= 2; d++) m = Math.max(m, x[Math.round(f) + d] ?? 0);
  return m;
}

/**
 * The bass band's accents halfway between the beats over its accents on them, or null when the grid is too
 * short to say. Low-register accents mark the beat level (Klapuri, Eronen & Astola 2006): well above 1, the
 * points in between are beats too.
 */
export function offBeatBassRatio(frames: number[], low: Float32Array): number | null {
  if (frames.length < MIN_BEATS_FOR_OFF_BEATS) return null;
  let on = 0;
  let off = 0;
  for (let i = 0; i + 1 < frames.length; i++) {
    on += peakNear(low, frames[i]!);
    off += peakNear(low, (frames[i]! + frames[i + 1]!) / 2);
  }
  return on > 0 ? off / on : off > 0 ? Infinity : null;
}

/**
 * When the bass band accents the points halfway between the beats more than the beats themselves (ratio above
 * `doubles`), those points are beats too: returns the grid with them inserted (refined to the onset peak as
 * the others), else null.
 */
export function beatsWithOffBeatBass(
  frames: number[],
  onset: Float32Array,
  low: Float32Array,
  doubles = OFF_BEAT_BASS_DOUBLES,
): number[] | null {
  const ratio = offBeatBassRatio(frames, low);
  if (ratio === null || !(ratio > doubles)) return null;
  const out: number[] = [];
  frames.forEach((f, i) => {
    out.push(f);
    const next = frames[i + 1];
    if (next !== undefined) out.push(refinePeak(onset, Math.round((f + next) / 2)));
  });
  return out;
}
