// Stage 2 — periodicity: how strongly the onset envelope repeats at each tempo, over the whole recording
// (autocorrelation with a comb over the first multiples of the period) and window by window (a local
// autocorrelation tempogram, Grosche & Müller 2011), from which a tempo path is tracked.
import { parabolicOffset } from './numbers';
import { autocorrelation } from './spectrum';

export const MIN_BPM = 30;
export const MAX_BPM = 300;

export const bpmToLag = (bpm: number, frameRate: number) => (60 * frameRate) / bpm;

export interface PeriodicityCurve {
  /** Tempo grid (BPM), log-spaced from MIN_BPM to MAX_BPM. */
  bpm: Float32Array;
  /** Comb-filtered autocorrelation at each grid tempo, normalised so the energy r[0] is 1. */
  score: Float32Array;
  /** The normalised autocorrelation itself, by lag in frames. */
  acf: Float32Array;
  frameRate: number;
}

const GRID_POINTS = 1200;
const COMB = [1, 0.5, 1 / 3, 1 / 4];

export function globalPeriodicity(envelope: Float32Array, frameRate: number): PeriodicityCurve {
  const maxLag = Math.min(envelope.length - 1, Math.ceil(bpmToLag(MIN_BPM, frameRate) * COMB.length) + 2);
  const raw = autocorrelation(envelope, Math.max(1, maxLag));
  const acf = new Float32Array(raw.length);
  const n = envelope.length;
  const energy = raw[0]! || 1;
  // Unbiased: long lags overlap fewer frames, so scale each lag back up by n / (n − lag).
  for (let lag = 0; lag < raw.length; lag++) acf[lag] = (raw[lag]! / energy) * (n / Math.max(1, n - lag));
  const bpm = new Float32Array(GRID_POINTS);
  const score = new Float32Array(GRID_POINTS);
  const ratio = Math.log(MAX_BPM / MIN_BPM);
  for (let i = 0; i < GRID_POINTS; i++) {
    const b = MIN_BPM * Math.exp((ratio * i) / (GRID_POINTS - 1));
    bpm[i] = b;
    const lag = bpmToLag(b, frameRate);
    let s = 0;
    for (let k = 0; k < COMB.length; k++) s += COMB[k]! * peakNear(acf, lag * (k + 1));
    score[i] = s / 2.0833; // Σ COMB, so a perfect pulse scores ~1
  }
  return { bpm, score, acf, frameRate };
}

/**
 * The autocorrelation's best value at the integer lags within ±1 frame of a fractional lag: a sharp peak is
 * found whatever the grid's phase, at the price of flat-topped peaks (the beat tracker refines the tempo).
 */
export function peakNear(acf: Float32Array, lag: number): number {
  let best = 0;
  for (let j = Math.max(0, Math.floor(lag - 1)); j <= Math.ceil(lag + 1) && j < acf.length; j++)
    if (acf[j]! > best) best = acf[j]!;
  return best;
}

/**
 * How strongly the envelope repeats at one tempo, judged window by window (8 s, so a drifting tempo does not
 * smear the peak as it does over a whole take): the mean over windows of the best normalised local
 * autocorrelation within ±3 % of the tempo's lag.
 */
export function localPulse(envelope: Float32Array, frameRate: number, bpm: number, windowSec = 8): number {
  const lag = bpmToLag(bpm, frameRate);
  const lo = Math.max(1, Math.floor(lag * 0.97));
  const hi = Math.ceil(lag * 1.03);
  const win = Math.min(envelope.length, Math.round(windowSec * frameRate));
  if (win <= hi + 1) return 0;
  let total = 0;
  let count = 0;
  for (let s = 0; s + win <= envelope.length; s += Math.round(win / 2)) {
    let energy = 0;
    for (let i = s; i < s + win; i++) energy += envelope[i]! * envelope[i]!;
    if (energy <= 0) continue;
    let best = 0;
    for (let l = lo; l <= hi; l++) {
      let acc = 0;
      for (let i = s; i < s + win - l; i++) acc += envelope[i]! * envelope[i + l]!;
      best = Math.max(best, (acc / energy) * (win / (win - l)));
    }
    total += best;
    count++;
  }
  return count ? total / count : 0;
}

export interface Tempogram {
  /** Window centres, in frames. */
  centres: number[];
  minLag: number;
  maxLag: number;
  /** values[w][lag − minLag]: normalised local autocorrelation. */
  values: Float32Array[];
}

export function localTempogram(
  envelope: Float32Array,
  frameRate: number,
  minLag: number,
  maxLag: number,
  windowSec = 8,
  hopSec = 1,
): Tempogram {
  const win = Math.min(envelope.length, Math.round(windowSec * frameRate));
  const hop = Math.max(1, Math.round(hopSec * frameRate));
  const centres: number[] = [];
  const values: Float32Array[] = [];
  const lastStart = Math.max(0, envelope.length - win);
  for (let start = 0; ; start += hop) {
    const s = Math.min(start, lastStart);
    const row = new Float32Array(maxLag - minLag + 1);
    let energy = 0;
    for (let i = s; i < s + win; i++) energy += envelope[i]! * envelope[i]!;
    if (energy > 0) {
      for (let lag = minLag; lag <= maxLag; lag++) {
        let acc = 0;
        const end = s + win - lag;
        for (let i = s; i < end; i++) acc += envelope[i]! * envelope[i + lag]!;
        row[lag - minLag] = (acc / energy) * (win / Math.max(1, win - lag));
      }
    }
    centres.push(s + win / 2);
    values.push(row);
    if (s === lastStart) break;
  }
  return { centres, minLag, maxLag, values };
}

/**
 * The beat period over time, kept near one metrical level: a Viterbi path through the tempogram whose steps
 * cost in proportion to the change of log-period, so that ramps and ritardandos are followed but a jump to
 * the double or half tempo is not taken.
 * @param centreLag the period of the global tempo, in frames
 */
export function trackPeriod(tg: Tempogram, centreLag: number, changePenalty = 30, centrePull = 0.5): number[] {
  const states = tg.maxLag - tg.minLag + 1;
  const W = tg.values.length;
  if (W === 0) return [];
  const logLag = Float64Array.from({ length: states }, (_, i) => Math.log(tg.minLag + i));
  // A gentle pull toward the global tempo: a competing pulse of a syncopated groove (the dotted eighth of a
  // funk pattern) must be much stronger than the beat, window after window, to take the path over.
  const pull = Float64Array.from(logLag, (l) => centrePull * Math.abs(l - Math.log(centreLag)));
  let cost = Float64Array.from(tg.values[0]!, (v, j) => pull[j]! - v);
  const back: Int32Array[] = [];
  for (let w = 1; w < W; w++) {
    const next = new Float64Array(states);
    const from = new Int32Array(states);
    const row = tg.values[w]!;
    for (let j = 0; j < states; j++) {
      let best = Infinity;
      let arg = j;
      // Tempo moves by far less than 25 % in one hop of a second; limit the search for speed.
      const lo = Math.max(0, j - Math.ceil(states / 6));
      const hi = Math.min(states - 1, j + Math.ceil(states / 6));
      for (let i = lo; i <= hi; i++) {
        const c = cost[i]! + changePenalty * Math.abs(logLag[j]! - logLag[i]!);
        if (c < best) {
          best = c;
          arg = i;
        }
      }
      next[j] = best - row[j]! + pull[j]!;
      from[j] = arg;
    }
    back.push(from);
    cost = next;
  }
  let state = 0;
  for (let j = 1; j < states; j++) if (cost[j]! < cost[state]!) state = j;
  const path = new Array<number>(W);
  for (let w = W - 1; w >= 0; w--) {
    path[w] = state + parabolicOffset(tg.values[w]!, state) + tg.minLag;
    if (w > 0) state = back[w - 1]![state]!;
  }
  return path;
}
