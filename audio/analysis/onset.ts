// Stage 1 — onset strength envelope: log-compressed spectral flux (after Böck, Krebs & Schedl 2012 and
// Ellis 2007), half-wave rectified, with its slow trend removed so that periodicity measures see the attacks.
import { forEachSpectrum } from './spectrum';

export interface OnsetEnvelope {
  /** Onset strength per frame (all bands). */
  strength: Float32Array;
  /** Onset strength of the lowest band only (bass, kick): used for meter and downbeats. */
  low: Float32Array;
  /** Onset strength above the lowest band (snare, hands, hi-hat, chords): against `low`, the backbeat. */
  upper: Float32Array;
  /** Frames per second. */
  frameRate: number;
  /** Seconds of the first frame's centre (negative: the first frames hang over the start). */
  offsetSec: number;
}

export const FRAME_SIZE = 512;
export const HOP = 128;
const COMPRESSION = 1000; // γ in log(1 + γ|X|)
const LOW_BAND_HZ = 150; // kick drum and bass fundamentals; a snare's body sits above

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
    FRAME_SIZE,
  );
  const frameRate = sampleRate / HOP;
  return {
    strength: removeTrend(strength, Math.round(frameRate * 0.4)),
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
