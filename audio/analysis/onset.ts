// Stage 1 — onset strength envelope: log-compressed spectral flux (after Böck, Krebs & Schedl 2012 and
// Ellis 2007), half-wave rectified, with its slow trend removed so that periodicity measures see the attacks.
// Beside it a harmonic-change novelty (the rise of a chroma vector from frame to frame, after Harte, Sandler
// & Gasser 2006): music without percussion (a string quartet, a piano played legato) marks its beats by
// changes of harmony more than by attacks.
import { forEachSpectrum } from './spectrum';

export interface OnsetEnvelope {
  /** Onset strength per frame (all bands). */
  strength: Float32Array;
  /** Onset strength of the lowest band only (bass, kick): used for meter and downbeats. */
  low: Float32Array;
  /** Onset strength above the lowest band (snare, hands, hi-hat, chords): against `low`, the backbeat. */
  upper: Float32Array;
  /**
   * Attacks and harmonic changes, each scaled to unit standard deviation and summed with equal weight: the
   * envelope whose periodicity gives the tempo candidates (analyse.ts ruleBasedTempo). Beats are placed on
   * `strength` alone, whose peaks are sharper (a chord change is blurred over the 186 ms chroma frame).
   */
  tempoNovelty: Float32Array;
  /** Frames per second. */
  frameRate: number;
  /** Seconds of the first frame's centre (negative: the first frames hang over the start). */
  offsetSec: number;
}

export const FRAME_SIZE = 512;
export const HOP = 128;
const COMPRESSION = 1000; // γ in log(1 + γ|X|)
const LOW_BAND_HZ = 150; // kick drum and bass fundamentals; a snare's body sits above
/** 2048 samples (186 ms at 11 025 Hz): bins of 5.4 Hz, a semitone apart from about 90 Hz up. */
const CHROMA_FRAME = 2048;
/** A quarter of the chroma frame (46 ms), the usual 75 % overlap; interpolated to the flux's frame rate. */
const CHROMA_HOP = 512;
/** Bass notes, chord tones and a melody's lower partials; above 2 kHz partials crowd and cymbals hiss. */
const CHROMA_LOW_HZ = 60;
const CHROMA_HIGH_HZ = 2000;
/** γ in log(1 + γ·chroma), as for the flux; not tuned (each novelty is scaled to unit deviation anyway). */
const CHROMA_COMPRESSION = 100;

export function onsetEnvelope(samples: Float32Array, sampleRate: number): OnsetEnvelope {
  const bins = FRAME_SIZE / 2 + 1;
  const lowBins = Math.max(2, Math.round((LOW_BAND_HZ * FRAME_SIZE) / sampleRate));
  const frames = Math.max(0, Math.floor(samples.length / HOP) + 1);
  const strength = new Float32Array(frames);
  const low = new Float32Array(frames);
  const upper = new Float32Array(frames);
  let prev = new Float32Array(bins);
  let cur = new Float32Array(bins);
  forEachSpectrum(
    samples,
    FRAME_SIZE,
    HOP,
    (f, mags) => {
      for (let k = 0; k < bins; k++) cur[k] = Math.log1p(COMPRESSION * mags[k]!);
      if (f > 0) {
        let all = 0;
        let bass = 0;
        for (let k = 1; k < bins; k++) {
          const d = cur[k]! - prev[k]!;
          if (d > 0) {
            all += d;
            if (k < lowBins) bass += d;
          }
        }
        strength[f] = all;
        low[f] = bass;
        upper[f] = all - bass;
      }
      const t = prev;
      prev = cur;
      cur = t;
    },
    { padStart: FRAME_SIZE },
  );
  const frameRate = sampleRate / HOP;
  const attacks = removeTrend(strength, Math.round(frameRate * 0.4));
  const harmony = removeTrend(harmonicChange(samples, sampleRate, frames), Math.round(frameRate * 0.4));
  const toAttackScale = standardDeviation(attacks) / (standardDeviation(harmony) || 1);
  const tempoNovelty = attacks.map((a, i) => a + toAttackScale * harmony[i]!);
  return {
    strength: attacks,
    tempoNovelty,
    low: removeTrend(low, Math.round(frameRate * 0.4)),
    upper: removeTrend(upper, Math.round(frameRate * 0.4)),
    frameRate,
    // FRAME_SIZE zeros are read before the signal: frame f is centred at f·HOP − FRAME_SIZE/2 samples.
    offsetSec: -FRAME_SIZE / 2 / sampleRate,
  };
}

/** x minus its centred moving average, half-wave rectified. */
function removeTrend(x: Float32Array, halfWidth: number): Float32Array {
  const n = x.length;
  const out = new Float32Array(n);
  const prefix = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) prefix[i + 1] = prefix[i]! + x[i]!;
  for (let i = 0; i < n; i++) {
    const a = Math.max(0, i - halfWidth);
    const b = Math.min(n, i + halfWidth + 1);
    const mean = (prefix[b]! - prefix[a]!) / (b - a);
    const v = x[i]! - mean;
    out[i] = v > 0 ? v : 0;
  }
  return out;
}

function standardDeviation(x: Float32Array): number {
  let mean = 0;
  for (let i = 0; i < x.length; i++) mean += x[i]!;
  mean /= x.length || 1;
  let v = 0;
  for (let i = 0; i < x.length; i++) v += (x[i]! - mean) ** 2;
  return Math.sqrt(v / (x.length || 1));
}

/**
 * The rise of the log-compressed chroma (12 pitch classes) from one chroma frame to the next, half-wave
 * rectified and summed, at the flux's `frames` (frame f centred where the flux's frame f is).
 */
function harmonicChange(samples: Float32Array, sampleRate: number, frames: number): Float32Array {
  // Only the bins from CHROMA_LOW_HZ to CHROMA_HIGH_HZ are read out, as power (no square root).
  const kLo = Math.ceil((CHROMA_LOW_HZ * CHROMA_FRAME) / sampleRate);
  const kHi = Math.floor((CHROMA_HIGH_HZ * CHROMA_FRAME) / sampleRate);
  const pitchClass = new Int8Array(kHi + 1);
  for (let k = kLo; k <= kHi; k++)
    pitchClass[k] = ((Math.round(12 * Math.log2((k * sampleRate) / CHROMA_FRAME / 440)) % 12) + 12) % 12;
  const step = CHROMA_HOP / HOP;
  const coarse = new Float32Array(Math.ceil(frames / step) + 1);
  let prev = new Float32Array(12);
  let cur = new Float32Array(12);
  forEachSpectrum(
    samples,
    CHROMA_FRAME,
    CHROMA_HOP,
    (f, power) => {
      if (f >= coarse.length) return;
      cur.fill(0);
      for (let k = kLo; k <= kHi; k++) cur[pitchClass[k]!]! += power[k]!;
      for (let j = 0; j < 12; j++) cur[j] = Math.log1p(CHROMA_COMPRESSION * Math.sqrt(cur[j]!));
      if (f > 0) {
        let rise = 0;
        for (let j = 0; j < 12; j++) rise += Math.max(0, cur[j]! - prev[j]!);
        coarse[f] = rise;
      }
      const t = prev;
      prev = cur;
      cur = t;
    },
    // Centre chroma frame f where flux frame f·step is centred (f·HOP·step − FRAME_SIZE/2).
    { padStart: CHROMA_FRAME / 2 + FRAME_SIZE / 2, bins: kHi + 1, power: true },
  );
  const out = new Float32Array(frames);
  for (let i = 0; i < frames; i++) {
    const a = Math.floor(i / step);
    const w = i / step - a;
    out[i] = coarse[a]! * (1 - w) + (coarse[a + 1] ?? 0) * w;
  }
  return out;
}
