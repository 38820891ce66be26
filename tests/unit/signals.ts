// Test signals whose truth is exact by construction: clicks at known times, tones, silence.

export const RATE = 11025;

/** A short decaying 1 kHz burst (a metronome-like click) at each time, accent louder. */
export function clickTrack(times: number[], durationSec: number, rate = RATE, accents: Set<number> = new Set()): Float32Array {
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

export const tempoAt = (from: number, to: number, durationSec: number, t: number) => from + ((to - from) * t) / durationSec;

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
