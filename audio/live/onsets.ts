// The onset detector the capture worklet runs on the microphone, block by block: a note starts where the energy
// of a short hop jumps well above the recent background. Energy rather than spectral flux because the live view
// wants the attack's time to a few milliseconds, and the hop energy is cheap enough for every 128-sample block;
// the time is then refined to the first sample of the attack. Pure: fed typed arrays and context times.

/** Hop length in samples: one AudioWorklet render quantum (2.9 ms at 44.1 kHz), so a block is one hop. */
export const HOP = 128;
/**
 * An onset needs the hop's energy this many times the background (×4 = +6 dB). A struck or plucked note rises
 * by far more than that within a few milliseconds; room noise and a sustained note's wobble do not.
 */
const RISE = 4;
/** Background energy follows the hops with this time constant: long against an attack, short against a bar. */
const BACKGROUND_SEC = 0.1;
/** Below this level (−50 dBFS, RMS) nothing is an onset, however it rises: breath and the room, not a note. */
const FLOOR_RMS = 0.00316;
/**
 * After an onset no other for this long: a note's own ringing and a flam are one onset. 60 ms is shorter than a
 * sixteenth note at 240 BPM (62.5 ms), so every beat and most subdivisions still count (common practice).
 */
export const REFRACTORY_SEC = 0.06;
/** The attack starts at the first sample reaching this fraction of the hop's peak. */
const ATTACK_FRACTION = 0.3;

export class OnsetDetector {
  private background = 0;
  private lastOnset = -Infinity;
  private readonly previous = new Float32Array(HOP);
  private previousLength = 0;
  private readonly follow: number;

  constructor(private readonly sampleRate: number) {
    this.follow = 1 - Math.exp(-HOP / (sampleRate * BACKGROUND_SEC));
  }

  /**
   * One block of samples whose first sample sounds at context time `time`; returns the onsets found in it
   * (context times). Blocks of any length are taken, in HOP pieces.
   */
  push(block: Float32Array, time: number): number[] {
    const found: number[] = [];
    for (let from = 0; from < block.length; from += HOP) {
      const hop = block.subarray(from, Math.min(block.length, from + HOP));
      const onset = this.hop(hop, time + from / this.sampleRate);
      if (onset !== null) found.push(onset);
    }
    return found;
  }

  private hop(hop: Float32Array, time: number): number | null {
    let energy = 0;
    let peak = 0;
    for (let i = 0; i < hop.length; i++) {
      const v = hop[i]!;
      energy += v * v;
      peak = Math.max(peak, Math.abs(v));
    }
    energy /= hop.length || 1;
    let onset: number | null = null;
    if (energy > RISE * this.background && energy > FLOOR_RMS * FLOOR_RMS && time - this.lastOnset >= REFRACTORY_SEC) {
      onset = this.attackTime(hop, time, peak * ATTACK_FRACTION);
      if (onset - this.lastOnset < REFRACTORY_SEC) onset = null;
      else this.lastOnset = onset;
    }
    this.background += this.follow * (energy - this.background);
    this.previous.set(hop.subarray(0, HOP));
    this.previousLength = hop.length;
    return onset;
  }

  /**
   * The first sample at or above `level`, searched from the previous hop on: an attack that began late in the
   * previous hop only tipped the energy over in this one. (The previous hop did not rise above the background,
   * so what reaches the level there is this attack's start.)
   */
  private attackTime(hop: Float32Array, time: number, level: number): number {
    for (let j = 0; j < this.previousLength; j++)
      if (Math.abs(this.previous[j]!) >= level) return time - (this.previousLength - j) / this.sampleRate;
    for (let i = 0; i < hop.length; i++) if (Math.abs(hop[i]!) >= level) return time + i / this.sampleRate;
    return time;
  }
}
