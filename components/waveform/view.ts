// What a waveform view draws, worked out without React: the peaks as a min/max pyramid (so a long recording
// zoomed out reads a few coarse buckets per column rather than thousands), the columns of a time window, and the
// beat and bar lines thinned so they never crowd: beats only where they are far enough apart to read, bar numbers
// only where they cannot overlap.

/** One level of the pyramid: interleaved [min, max] per bucket, each bucket `bucketSec` long. */
export interface PeakLevel {
  minMax: Float32Array;
  bucketSec: number;
}

/** Level 0 is the server's peaks; each further level halves the bucket count by taking min and max of pairs. */
export function peakPyramid(minMax: number[], durationSec: number): PeakLevel[] {
  const levels: PeakLevel[] = [];
  let cur = Float32Array.from(minMax);
  let buckets = cur.length / 2;
  if (buckets === 0) return [{ minMax: cur, bucketSec: durationSec }];
  levels.push({ minMax: cur, bucketSec: durationSec / buckets });
  while (buckets > 1) {
    const n = Math.ceil(buckets / 2);
    const next = new Float32Array(2 * n);
    for (let b = 0; b < n; b++) {
      const a = 2 * b;
      const c = Math.min(a + 1, buckets - 1);
      next[2 * b] = Math.min(cur[2 * a]!, cur[2 * c]!);
      next[2 * b + 1] = Math.max(cur[2 * a + 1]!, cur[2 * c + 1]!);
    }
    cur = next;
    buckets = n;
    levels.push({ minMax: cur, bucketSec: durationSec / buckets });
  }
  return levels;
}

/**
 * Min and max of each of `columns` equal slices of [from, to), read from the coarsest level whose buckets are
 * still no wider than a column (so each column reads one or two buckets, whatever the zoom).
 */
export function columnsOf(
  levels: PeakLevel[],
  from: number,
  to: number,
  columns: number,
): { lo: number; hi: number }[] {
  const colSec = (to - from) / columns;
  let level = levels[0]!;
  for (const l of levels) if (l.bucketSec <= colSec) level = l;
  const n = level.minMax.length / 2;
  const out: { lo: number; hi: number }[] = [];
  for (let c = 0; c < columns; c++) {
    const t0 = from + c * colSec;
    const b0 = Math.floor(t0 / level.bucketSec);
    const b1 = Math.max(b0 + 1, Math.floor((t0 + colSec) / level.bucketSec));
    let lo = 0;
    let hi = 0;
    for (let b = Math.max(0, b0); b < Math.min(n, b1); b++) {
      lo = Math.min(lo, level.minMax[2 * b]!);
      hi = Math.max(hi, level.minMax[2 * b + 1]!);
    }
    out.push({ lo, hi });
  }
  return out;
}

/** Beat lines closer than this many pixels read as a smear, not as beats: they are left out (common practice for
 * ruler ticks; 6 px is about the gap an eye separates at arm's length on a phone, from memory). */
export const MIN_BEAT_GAP_PX = 6;
/** Space between one bar number's end and the next one's start. */
const LABEL_GAP_PX = 6;
/** A bar number starts this far right of its line. */
export const LABEL_OFFSET_PX = 3;
/** Width of one digit of the bar numbers (10 px medium type). */
export const DIGIT_PX = 6.5;
/** Bar numbers go 1, 2, 3… or every 2nd, 4th, 8th… bar: steps that keep four-bar phrases together. */
const LABEL_STEPS = [1, 2, 4, 8, 16, 32, 64, 128, 256];

export interface GridMarks {
  /** x of each beat line drawn (bar lines are drawn as bars). */
  beats: number[];
  /** x and number of each bar line drawn. */
  bars: { x: number; bar: number }[];
  /** The bar lines that carry their number. */
  labels: { x: number; bar: number }[];
  /** Every how many bars a number is shown. */
  labelEvery: number;
}

/** Median gap between neighbours (Infinity for fewer than two). */
function medianGap(xs: number[]): number {
  if (xs.length < 2) return Infinity;
  const gaps = xs
    .slice(1)
    .map((x, i) => x - xs[i]!)
    .sort((a, b) => a - b);
  return gaps[Math.floor(gaps.length / 2)]!;
}

/**
 * The grid marks of the window [from, to) drawn `width` px wide. Beats are drawn only when their median gap is
 * at least MIN_BEAT_GAP_PX; bar lines thin by the label step when they too would crowd; numbers step 1, 2, 4…
 * so the widest fits, then any number that would still touch the previous one is skipped.
 */
export function gridMarks(beats: number[], downbeats: number[], from: number, to: number, width: number): GridMarks {
  const px = width / (to - from);
  const x = (t: number) => (t - from) * px;
  const beatGapPx = medianGap(beats) * px;
  const barGapPx = medianGap(downbeats) * px;
  // A number sits LABEL_OFFSET_PX right of its line and needs LABEL_GAP_PX before the next.
  const widest = LABEL_OFFSET_PX + String(downbeats.length).length * DIGIT_PX + LABEL_GAP_PX;
  const labelEvery = LABEL_STEPS.find((s) => s * barGapPx >= widest) ?? LABEL_STEPS[LABEL_STEPS.length - 1]!;
  const lineEvery = LABEL_STEPS.find((s) => s * barGapPx >= MIN_BEAT_GAP_PX) ?? labelEvery;
  const downSet = new Set(downbeats.map((d) => Math.round(d * 1000)));
  const out: GridMarks = { beats: [], bars: [], labels: [], labelEvery };
  if (beatGapPx >= MIN_BEAT_GAP_PX)
    for (const b of beats) if (b >= from && b <= to && !downSet.has(Math.round(b * 1000))) out.beats.push(x(b));
  let lastEnd = -Infinity;
  downbeats.forEach((d, i) => {
    const bar = i + 1;
    if (d < from || d > to || (bar - 1) % lineEvery !== 0) return;
    out.bars.push({ x: x(d), bar });
    const w = String(bar).length * DIGIT_PX;
    // A number that would run past the right edge is left out rather than cut.
    if ((bar - 1) % labelEvery === 0 && x(d) >= lastEnd + LABEL_GAP_PX && x(d) + LABEL_OFFSET_PX + w <= width) {
      out.labels.push({ x: x(d), bar });
      lastEnd = x(d) + LABEL_OFFSET_PX + w;
    }
  });
  return out;
}

/** The zoom range: the whole recording down to about two bars (never under two seconds). */
export function zoomLimits(durationSec: number, downbeats: number[]): { min: number; max: number } {
  const bar = Number.isFinite(medianGap(downbeats)) ? medianGap(downbeats) : 2;
  return { min: Math.min(durationSec, Math.max(2, 2 * bar)), max: durationSec };
}

/** A window of `span` seconds keeping `t` at `share` of its width, inside [0, duration]. */
export function windowAround(t: number, span: number, durationSec: number, share = 0.5): { from: number; to: number } {
  const s = Math.min(span, durationSec);
  const from = Math.max(0, Math.min(durationSec - s, t - s * share));
  return { from, to: from + s };
}
