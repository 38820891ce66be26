// Stage 5 — meter and downbeats from beat-synchronous accents: in most music the bar's first beat carries
// the strongest low-register attack (bass note, kick). Groupings of 2, 3 and 4 beats are compared by how
// much one position stands out; 2 is reported as 4/4 with its stronger phase, as duple bars are usually
// written (common practice).

export interface MeterEstimate {
  beatsPerBar: number;
  /** Index (into the beat list) of the first downbeat. */
  phase: number;
  /** How clearly the bar position stands out (0 = not at all). */
  contrast: number;
}

export function estimateMeter(beatFrames: number[], low: Float32Array, all: Float32Array): MeterEstimate | null {
  if (beatFrames.length < 6) return null;
  const accent = beatFrames.map((f) => {
    const i = Math.round(f);
    let lowPeak = 0;
    let allPeak = 0;
    for (let d = -2; d <= 2; d++) {
      lowPeak = Math.max(lowPeak, low[i + d] ?? 0);
      allPeak = Math.max(allPeak, all[i + d] ?? 0);
    }
    return lowPeak + 0.25 * allPeak;
  });
  const mean = accent.reduce((a, b) => a + b, 0) / accent.length;
  const sd = Math.sqrt(accent.reduce((a, b) => a + (b - mean) ** 2, 0) / accent.length);
  // Beats all alike (a plain click): no evidence of a bar, so say 4/4 from the first beat (common practice).
  if (mean <= 0 || sd / mean < 0.1) return { beatsPerBar: 4, phase: 0, contrast: 0 };
  const z = accent.map((a) => (a - mean) / sd);

  const contrastFor = (m: number) => {
    let best = { phase: 0, contrast: -Infinity };
    for (let phase = 0; phase < m; phase++) {
      let on = 0;
      let onN = 0;
      let off = 0;
      let offN = 0;
      z.forEach((v, i) => {
        if ((i - phase) % m === 0) {
          on += v;
          onN++;
        } else {
          off += v;
          offN++;
        }
      });
      const c = on / Math.max(1, onN) - off / Math.max(1, offN);
      if (c > best.contrast) best = { phase, contrast: c };
    }
    return best;
  };
  const two = contrastFor(2);
  const three = contrastFor(3);
  const four = contrastFor(4);
  // A triple grouping must clearly beat the duple ones to be believed.
  if (three.contrast > 1.3 * Math.max(two.contrast, four.contrast) && three.contrast > 0.6) {
    return { beatsPerBar: 3, phase: three.phase, contrast: three.contrast };
  }
  const duple = four.contrast >= two.contrast * 0.9 ? four : { phase: two.phase, contrast: two.contrast };
  return { beatsPerBar: 4, phase: duple.phase % 4, contrast: Math.max(0, duple.contrast) };
}
