// Band-limited resampling to the analysis rate (windowed-sinc interpolation), for audio that arrives at
// another rate (the browser, the evaluation harness). The server's decoder resamples in ffmpeg instead.

export const ANALYSIS_RATE = 11025;
/** Phases of precomputed taps kept at most (4096 × 70 floats, about 1 MB); rarer ratios compute each tap. */
const MAX_PHASES = 4096;

const gcd = (a: number, b: number): number => (b === 0 ? a : gcd(b, a % b));

export function resample(input: Float32Array, fromRate: number, toRate: number = ANALYSIS_RATE): Float32Array {
  if (fromRate === toRate) return input;
  const ratio = fromRate / toRate;
  const outLength = Math.floor(input.length / ratio);
  const out = new Float32Array(outLength);
  // Cut-off just under the lower Nyquist frequency; 8 zero crossings each side, Blackman window (ample for
  // onset analysis, and twice as fast as 16).
  const cutoff = 0.94 * Math.min(1, 1 / ratio);
  const halfTaps = Math.ceil(8 / cutoff);
  const tableRes = 64;
  const table = new Float32Array(halfTaps * tableRes + 2);
  for (let i = 0; i < table.length; i++) {
    const x = i / tableRes;
    const sinc = x === 0 ? 1 : Math.sin(Math.PI * cutoff * x) / (Math.PI * cutoff * x);
    const w =
      x >= halfTaps
        ? 0
        : 0.42 + 0.5 * Math.cos((Math.PI * x) / halfTaps) + 0.08 * Math.cos((2 * Math.PI * x) / halfTaps);
    table[i] = cutoff * sinc * w;
  }
  const kernel = (d: number) => {
    const pos = Math.abs(d) * tableRes;
    const i = pos | 0;
    if (i >= table.length - 1) return 0;
    const frac = pos - i;
    return table[i]! + (table[i + 1]! - table[i]!) * frac;
  };
  // Output sample o lies at input position o·from/to: with the ratio reduced to p/q, its fraction of a sample
  // takes only q values. For the usual rates (44 100 → 11 025: q = 1; 48 000 → 11 025: q = 147) the taps of
  // each such phase are computed once instead of at every output sample, the same values in a third of the time.
  const g = gcd(Math.round(fromRate), Math.round(toRate));
  const p = Math.round(fromRate) / g;
  const q = Math.round(toRate) / g;
  const taps = 2 * halfTaps;
  if (Number.isInteger(fromRate) && Number.isInteger(toRate) && q <= MAX_PHASES) {
    const phases = new Float32Array(q * taps);
    for (let r = 0; r < q; r++)
      for (let j = 0; j < taps; j++) phases[r * taps + j] = kernel(r / q - (j - halfTaps + 1));
    for (let o = 0; o < outLength; o++) {
      const centre = Math.floor((o * p) / q);
      const base = ((o * p) % q) * taps;
      const first = centre - halfTaps + 1;
      const lo = Math.max(0, first);
      const hi = Math.min(input.length - 1, centre + halfTaps);
      let acc = 0;
      for (let i = lo; i <= hi; i++) acc += input[i]! * phases[base + i - first]!;
      out[o] = acc;
    }
    return out;
  }
  for (let o = 0; o < outLength; o++) {
    const t = o * ratio;
    const centre = Math.floor(t);
    let acc = 0;
    const lo = Math.max(0, centre - halfTaps + 1);
    const hi = Math.min(input.length - 1, centre + halfTaps);
    for (let i = lo; i <= hi; i++) acc += input[i]! * kernel(t - i);
    out[o] = acc;
  }
  return out;
}

/** Mixes interleaved or planar channels down to one. */
export function mixToMono(channels: Float32Array[]): Float32Array {
  if (channels.length === 1) return channels[0]!;
  const n = channels[0]!.length;
  const out = new Float32Array(n);
  for (const ch of channels) for (let i = 0; i < n; i++) out[i] = out[i]! + ch[i]!;
  const g = 1 / channels.length;
  for (let i = 0; i < n; i++) out[i] = out[i]! * g;
  return out;
}
