// Band-limited resampling to the analysis rate (windowed-sinc interpolation), for audio that arrives at
// another rate (the browser, the evaluation harness). The server's decoder resamples in ffmpeg instead.

export const ANALYSIS_RATE = 11025;

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
