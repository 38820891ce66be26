// Stage 4 — beat times by dynamic programming (Ellis 2007, "Beat Tracking by Dynamic Programming", JNMR
// 36(1)) over (beat, interval) states: each beat is reached by an interval that may change from the one
// before it by a few per cent at a cost, so the tempo can move beat by beat through a ritardando or a push
// (tempo states as in Degara et al. 2012 and the bar pointer of Krebs et al. 2015, without learning), held
// gently toward the tempo path tracked over 8-second windows; through a quiet passage the interval simply
// carries on, so the phase is kept. Beat positions are then refined to the sub-frame peak of the onset
// envelope; a grid whose off-beats carry the bass is doubled (beatsWithOffBeatBass).
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
/**
 * The most an interval may differ from the one before it: 6 %. A ritardando to −20 % and back over four bars
 * of 4/4 (issue 14) changes by at most 4 % a beat at its steepest; 6 % leaves room for a player's unevenness
 * while keeping the search (and the time it takes) small.
 */
const MAX_STEP = 0.06;
/**
 * Weight on the squared log-ratio of consecutive intervals. A 3 % step (a deep ritardando) costs 0.27, far
 * below one beat's normalised onset strength, so real tempo changes are followed; a 20 % jump costs 10, so a
 * stray accent cannot pull the grid. Tried 100 / 300 / 1000 on the real recordings: beat F 0.844 / 0.846 /
 * 0.842 (within noise; 300 the middle of a flat optimum).
 */
const CONTINUITY = 300;
/**
 * Weight on the squared log-ratio of an interval to the tempo path's period (Ellis's α, 100 before): the
 * path is read through 8-second windows that smear a ritardando of a few bars, so it guides the tracker
 * only gently. At 100 the tracker keeps the path's period through a −20 % ritardando and slips two beats;
 * at 30 it follows, with the same figures on the real recordings.
 */
const PATH_PULL = 30;
/** At each frame, intervals range over the tempo path's period there ÷ and × 1.32, the range of the path itself (analyse.ts). */
const INTERVAL_RANGE = 1.32;

export interface BeatTrackOptions {
  /** How strongly each interval is held to the tracked tempo path (Ellis's α, on the path's period). */
  pathPull?: number;
  /** How strongly each interval is held to the one before it (the tempo's own continuity, beat to beat). */
  continuity?: number;
}

/** Returns beat positions in (fractional) frames. */
export function trackBeats(onset: Float32Array, periodAt: Float32Array, opts: BeatTrackOptions = {}): number[] {
  const n = onset.length;
  if (n === 0) return [];
  const pathPull = opts.pathPull ?? PATH_PULL;
  const continuity = opts.continuity ?? CONTINUITY;
  const local = localScore(onset);

  // States: a beat at frame i reached by an interval of d frames. The interval may change from beat to beat
  // (a ritardando, a push), at a cost in its squared log-ratio, and is pulled more gently toward the path.
  let pMin = Infinity;
  let pMax = 0;
  for (let i = 0; i < n; i++) {
    pMin = Math.min(pMin, periodAt[i]!);
    pMax = Math.max(pMax, periodAt[i]!);
  }
  const dMin = Math.max(2, Math.floor(pMin / INTERVAL_RANGE));
  const dMax = Math.ceil(pMax * INTERVAL_RANGE);
  const D = dMax - dMin + 1;
  const logD = Float64Array.from({ length: D }, (_, k) => Math.log(dMin + k));
  // score[i·D + k]: the best track whose last beat is at frame i, reached by an interval of dMin + k frames;
  // from[…]: the previous beat's interval index, or FIRST when the previous beat opens the track.
  const FIRST = D;
  // Which earlier intervals may lead to each interval (within MAX_STEP), and what the step costs: the same
  // for every frame, so computed once.
  const lo = new Int32Array(D);
  const hi = new Int32Array(D);
  const stepAt = new Int32Array(D);
  const steps: number[] = [];
  for (let k = 0; k < D; k++) {
    const d = dMin + k;
    lo[k] = Math.max(0, Math.floor(d / (1 + MAX_STEP)) - dMin);
    hi[k] = Math.min(D - 1, Math.ceil(d * (1 + MAX_STEP)) - dMin);
    stepAt[k] = steps.length;
    for (let k2 = lo[k]!; k2 <= hi[k]!; k2++) steps.push(continuity * (logD[k]! - logD[k2]!) ** 2);
  }
  const stepCost = Float64Array.from(steps);
  const score = new Float32Array(n * D).fill(-Infinity);
  const from = new Int16Array(n * D).fill(FIRST);
  for (let i = 0; i < n; i++) {
    const logTau = Math.log(periodAt[i]!);
    // Only intervals within the range of the path's period at this frame are states here.
    const kFrom = Math.max(0, Math.floor(periodAt[i]! / INTERVAL_RANGE) - dMin);
    const kTo = Math.min(D - 1, Math.ceil(periodAt[i]! * INTERVAL_RANGE) - dMin);
    for (let k = kFrom; k <= kTo; k++) {
      const p = i - dMin - k;
      if (p < 0) break;
      // The previous beat may open the track (Ellis's restart where the cumulative score has nothing to give).
      let link = local[p]!;
      let arg = FIRST;
      const base = p * D;
      const cost = stepAt[k]! - lo[k]!;
      for (let k2 = lo[k]!; k2 <= hi[k]!; k2++) {
        const c = score[base + k2]! - stepCost[cost + k2]!;
        if (c > link) {
          link = c;
          arg = k2;
        }
      }
      score[i * D + k] = local[i]! - pathPull * (logD[k]! - logTau) ** 2 + link;
      from[i * D + k] = arg;
    }
  }

  // Last beat: the best track ending within the final period.
  const lastPeriod = Math.ceil(periodAt[n - 1]!);
  let end = n - 1;
  let endK = -1;
  let endScore = -Infinity;
  for (let i = Math.max(0, n - lastPeriod); i < n; i++) {
    for (let k = 0; k < D; k++) {
      if (score[i * D + k]! > endScore) {
        endScore = score[i * D + k]!;
        end = i;
        endK = k;
      }
    }
  }
  const frames: number[] = [end];
  for (let i = end, k = endK; k >= 0 && k < FIRST;) {
    const p = i - (dMin + k);
    frames.push(p);
    k = from[i * D + k]!;
    i = p;
  }
  frames.reverse();
  return trimWeakEdges(frames, local).map((f) => refinePeak(onset, f));
}

/** The onset envelope over its standard deviation, smoothed lightly (librosa's local score). */
function localScore(onset: Float32Array): Float32Array {
  const n = onset.length;
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
  return local;
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
