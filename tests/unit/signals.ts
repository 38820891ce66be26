// Test signals whose truth is exact by construction: clicks at known times, tones, silence, hits over a bed.
// The stretch benchmark (fixtures/bench-stretch.ts) uses them too.

export const RATE = 11025;

/** A short decaying 1 kHz burst (a metronome-like click) at each time, accent louder. */
export function clickTrack(
  times: number[],
  durationSec: number,
  rate = RATE,
  accents: Set<number> = new Set(),
): Float32Array {
  const out = new Float32Array(Math.round(durationSec * rate));
  const len = Math.round(0.03 * rate);
  times.forEach((t, idx) => {
    const start = Math.round(t * rate);
    const gain = accents.has(idx) ? 0.9 : 0.5;
    for (let i = 0; i < len && start + i < out.length; i++) {
      out[start + i]! += gain * Math.exp(-i / (0.005 * rate)) * Math.sin((2 * Math.PI * 1000 * i) / rate);
    }
  });
  return out;
}

export const steadyBeats = (bpm: number, durationSec: number, start = 0.5) => {
  const out: number[] = [];
  for (let t = start; t < durationSec - 0.1; t += 60 / bpm) out.push(t);
  return out;
};

/** Beat times for a tempo that moves linearly from `from` to `to` BPM over `durationSec` (exact integral). */
export function rampBeats(from: number, to: number, durationSec: number, start = 0.5): number[] {
  const k = (to - from) / durationSec; // BPM per second
  const beats: number[] = [];
  // beat phase φ(t) = ∫ bpm/60 dt = (from·t + k t²/2) / 60
  for (let b = 0; ; b++) {
    // solve (k/2) t² + from t − 60 b = 0
    const t = k === 0 ? (60 * b) / from : (-from + Math.sqrt(from * from + 2 * k * 60 * b)) / k;
    if (start + t >= durationSec - 0.1) break;
    beats.push(start + t);
  }
  return beats;
}

export const tempoAt = (from: number, to: number, durationSec: number, t: number) =>
  from + ((to - from) * t) / durationSec;

/** A sustained chord (A minor, three partials each) with one attack: no pulse to find. */
export function singleChord(durationSec: number, rate = RATE): Float32Array {
  const out = new Float32Array(Math.round(durationSec * rate));
  const freqs = [220, 261.63, 329.63];
  for (let i = 0; i < out.length; i++) {
    const env = Math.min(1, i / (0.01 * rate)) * Math.exp(-i / (2.5 * rate));
    let v = 0;
    for (const f of freqs) for (let h = 1; h <= 3; h++) v += Math.sin((2 * Math.PI * f * h * i) / rate) / (h * 3);
    out[i] = 0.3 * env * v;
  }
  return out;
}

/**
 * Decaying 900 Hz hits (about a drum's length) every 0.5 s over a soft bed that is never silent (two tones and a
 * little noise), as in music; `uneven` moves every second and third hit by 13 or 26 ms, so no hit sits at the
 * same place in a stretcher's sequences each time. Returns the samples and the hit times.
 */
export function hitsOverBed(seconds: number, rate: number, uneven = false): { x: Float32Array; hits: number[] } {
  const x = new Float32Array(seconds * rate);
  let seed = 7;
  const noise = () => ((seed = (seed * 16807) % 2147483647) / 2147483647) * 2 - 1;
  for (let i = 0; i < x.length; i++)
    x[i] =
      0.04 * Math.sin((2 * Math.PI * 220 * i) / rate) +
      0.03 * Math.sin((2 * Math.PI * 331 * i) / rate) +
      0.01 * noise();
  const hits = Array.from({ length: seconds * 2 - 4 }, (_, k) => 0.5 + k * 0.5 + (uneven ? (k % 3) * 0.013 : 0));
  for (const t of hits) {
    for (let i = 0, j = Math.round(t * rate); i < 0.08 * rate; i++, j++)
      x[j] = x[j]! + 0.8 * Math.exp(-i / (0.015 * rate)) * Math.sin((2 * Math.PI * 900 * i) / rate);
  }
  return { x, hits };
}

/** Attacks in a signal like hitsOverBed's: where it first passes 0.3 after 100 ms below 0.2 (seconds). */
export function attackTimes(x: Float32Array, rate: number): number[] {
  const out: number[] = [];
  let lastLoud = -rate;
  let armed = false;
  for (let i = 0; i < x.length; i++) {
    const v = Math.abs(x[i]!);
    if (v > 0.2) {
      if (i - lastLoud > 0.1 * rate) armed = true;
      lastLoud = i;
    }
    if (armed && v > 0.3) {
      out.push(i / rate);
      armed = false;
    }
  }
  return out;
}

/** A sine of amplitude 0.5 at `hz`. */
export const sineTone = (hz: number, seconds: number, rate: number) =>
  Float32Array.from({ length: Math.round(seconds * rate) }, (_, i) => 0.5 * Math.sin((2 * Math.PI * hz * i) / rate));

/** Frequency from the interval between the first and last rising zero crossings (interpolated) in [from, to). */
export function zeroCrossingFrequency(x: Float32Array, rate: number, from = 0, to = x.length): number {
  let first = -1;
  let last = -1;
  let count = 0;
  for (let i = from + 1; i < to; i++) {
    if (x[i - 1]! < 0 && x[i]! >= 0) {
      const at = i - 1 + x[i - 1]! / (x[i - 1]! - x[i]!);
      if (first < 0) first = at;
      last = at;
      count++;
    }
  }
  return (count - 1) / ((last - first) / rate);
}

/**
 * A drum groove at `bpm`: kick (a 60 Hz thump) on beats 1 and 3, snare (a noise burst) on 2 and 4, closed
 * hi-hat (short high noise) on every eighth note, all equally loud — the backbeat pattern of rock, pop and
 * hip-hop (common practice), whose beat is the quarter note although the hi-hat pulse is twice as fast.
 * Noise from a fixed-seed generator, so the signal is the same on every run. Returns samples and beat times.
 */
export function backbeatGroove(bpm: number, seconds: number, rate = RATE): { x: Float32Array; beats: number[] } {
  const x = new Float32Array(Math.round(seconds * rate));
  let seed = 12345;
  const noise = () => {
    seed = (seed * 1103515245 + 12345) % 2147483648;
    return seed / 1073741824 - 1;
  };
  const add = (t: number, len: number, sample: (i: number) => number) => {
    const start = Math.round(t * rate);
    for (let i = 0; i < len * rate && start + i < x.length; i++) x[start + i]! += sample(i);
  };
  const beats = steadyBeats(bpm, seconds);
  let prevHat = 0;
  beats.forEach((t, i) => {
    if (i % 2 === 0) add(t, 0.2, (k) => 0.8 * Math.exp(-k / (0.06 * rate)) * Math.sin((2 * Math.PI * 60 * k) / rate));
    else add(t, 0.15, (k) => 0.5 * Math.exp(-k / (0.04 * rate)) * noise());
    for (const h of [t, t + 30 / bpm])
      add(h, 0.04, (k) => {
        // First difference of noise: a crude high-pass, as a closed hi-hat sounds.
        const n = noise();
        const v = n - prevHat;
        prevHat = n;
        return 0.25 * Math.exp(-k / (0.01 * rate)) * v;
      });
  });
  return { x, beats };
}
