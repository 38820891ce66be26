// The steadiness report of a take: tempo by bar from the beat grid the player feels, smoothed over a window the
// player sets, against a reference tempo; start and end tempo, drift, stability, and the bars that run faster or
// slower than the reference by more than a tolerance. Regions the player marked as intended (rubato,
// ritardando) are left out of every figure. Pure: the recording screen computes it from the stored analysis, so
// a change of window, tolerance, beat level or bar one redraws it at once.
import { barBoundaries, type Grid } from './passage';
import { smoothTempo, tempoByBar, type BarTempo } from './tempo-by-bar';
import { formatBpm } from '@/shared/format';

export type IntendedKind = 'rubato' | 'ritardando';

/** A stretch of the recording the player meant to play freely or slowing down. */
export interface IntendedChange {
  kind: IntendedKind;
  startSec: number;
  endSec: number;
}

export interface SteadinessOptions {
  /** The tempo the take is held against (the song's chosen tempo, or the take's own); null: the take's own. */
  referenceBpm?: number | null;
  /** Bars in the smoothing window (odd; an even number is widened by one). */
  windowBars?: number;
  /** How far, in percent, a smoothed bar may stray from the reference before it counts as faster or slower. */
  tolerancePct?: number;
  intended?: IntendedChange[];
}

export interface TempoRegion {
  direction: 'faster' | 'slower';
  firstBar: number;
  lastBar: number;
  startSec: number;
  endSec: number;
  /** Mean of the smoothed bars' distance from the reference, in percent (positive = faster). */
  offPct: number;
}

export interface IntendedBars extends IntendedChange {
  /** The bars it covers (0 when it lies before bar 1). */
  firstBar: number;
  lastBar: number;
}

export interface SteadinessReport {
  /** Every bar's tempo (intended bars included, flagged), as tempoByBar reads it. */
  bars: (BarTempo & { intended: IntendedKind | null })[];
  /** The counted bars' tempo smoothed over the window; intended bars are not smoothed into their neighbours. */
  smoothed: BarTempo[];
  referenceBpm: number | null;
  startBpm: number | null;
  endBpm: number | null;
  /** (end − start) / start × 100. */
  driftPct: number | null;
  /** Coefficient of variation of beat-to-beat tempo over the counted beats, in percent. */
  stabilityPct: number | null;
  /** Counted beats per minute of counted time. */
  meanBpm: number | null;
  regions: TempoRegion[];
  intended: IntendedBars[];
  windowBars: number;
  tolerancePct: number;
  countedBars: number;
}

/** One bar either side: a single bar's wobble is smoothed away, a four-bar phrase that drags is not. */
export const DEFAULT_WINDOW_BARS = 3;
export const WINDOW_CHOICES = [1, 3, 5, 9] as const;
/** ±3 %: the issue's default; tempo changes of a few percent are where listeners begin to notice them (Drake &
 * Botte 1993 report discrimination thresholds of roughly 2–5 % for isochronous sequences, from memory). */
export const DEFAULT_TOLERANCE_PCT = 3;
export const TOLERANCE_CHOICES = [2, 3, 5, 8] as const;
/** Start and end tempo are read from a line through this many bars at each end: a four-bar phrase (common
 * practice), enough to outvote one stray bar, short enough to follow a take that changes. */
export const EDGE_BARS = 4;
/** A mark overlapping a bar or beat interval by less than this (seconds) does not claim it: a mark drawn to a bar
 * line should not take the next bar with it. */
const OVERLAP_SEC = 0.02;

const overlaps = (from: number, to: number, marks: IntendedChange[]) =>
  marks.find((m) => Math.min(to, m.endSec) - Math.max(from, m.startSec) > OVERLAP_SEC) ?? null;

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
};

/**
 * The Theil–Sen line through (x, y) read at `at`: the median of the pairwise slopes and the median intercept
 * (Theil 1950, Sen 1968). Exact on a straight line, and one wild bar among four does not tip it.
 */
export function theilSenAt(points: { x: number; y: number }[], at: number): number {
  if (points.length === 1) return points[0]!.y;
  const slopes: number[] = [];
  for (let i = 0; i < points.length; i++)
    for (let j = i + 1; j < points.length; j++)
      if (points[j]!.x !== points[i]!.x) slopes.push((points[j]!.y - points[i]!.y) / (points[j]!.x - points[i]!.x));
  const slope = slopes.length ? median(slopes) : 0;
  const intercept = median(points.map((p) => p.y - slope * p.x));
  return intercept + slope * at;
}

/**
 * Beat-to-beat tempo (60 / each interval) of the intervals no mark touches: the series whose coefficient of
 * variation is the stability figure.
 */
export function countedBeatTempi(beats: number[], intended: IntendedChange[] = []): number[] {
  const out: number[] = [];
  for (let i = 1; i < beats.length; i++) {
    const ibi = beats[i]! - beats[i - 1]!;
    if (ibi > 0 && !overlaps(beats[i - 1]!, beats[i]!, intended)) out.push(60 / ibi);
  }
  return out;
}

/**
 * The coefficient of variation (standard deviation / mean, population form) of beat-to-beat tempo, in percent.
 * The tapping and synchronisation literature reports timing variability this way so that takes at different
 * tempos compare (Repp 2005, "Sensorimotor synchronization: a review of the tapping literature", Psychonomic
 * Bulletin & Review 12(6); there of inter-tap intervals — from memory). Of tempo rather than of intervals
 * because the player reads tempo; for small variations the two agree to first order.
 */
export function coefficientOfVariationPct(xs: number[]): number | null {
  if (xs.length < 2) return null;
  const mean = xs.reduce((a, b) => a + b, 0) / xs.length;
  const sd = Math.sqrt(xs.reduce((a, b) => a + (b - mean) ** 2, 0) / xs.length);
  return (sd / mean) * 100;
}

const ODD = (n: number) => Math.max(1, Math.floor(n / 2) * 2 + 1);

export function steadiness(grid: Grid, options: SteadinessOptions = {}): SteadinessReport {
  const windowBars = ODD(options.windowBars ?? DEFAULT_WINDOW_BARS);
  const tolerancePct = options.tolerancePct ?? DEFAULT_TOLERANCE_PCT;
  const marks = (options.intended ?? []).filter((m) => m.endSec > m.startSec);
  const bounds = barBoundaries(grid);
  const ends = new Map(grid.downbeats.map((d, i) => [i + 1, bounds[i + 1] ?? grid.durationSec]));
  const bars = tempoByBar(grid).map((b) => ({
    ...b,
    intended: overlaps(b.start, ends.get(b.bar) ?? b.start, marks)?.kind ?? null,
  }));
  const counted = bars.filter((b) => b.intended === null);
  const smoothed = smoothTempo(counted, windowBars);

  const tempi = countedBeatTempi(grid.beats, marks);
  const meanBpm = tempi.length ? (tempi.length * 60) / tempi.reduce((a, t) => a + 60 / t, 0) : null;
  const stabilityPct = coefficientOfVariationPct(tempi);

  let startBpm: number | null = null;
  let endBpm: number | null = null;
  if (counted.length > 0) {
    const k = Math.max(1, Math.min(EDGE_BARS, Math.floor(counted.length / 2)));
    const pts = counted.map((b) => ({ x: b.bar, y: b.bpm }));
    startBpm = theilSenAt(pts.slice(0, k), counted[0]!.bar);
    endBpm = theilSenAt(pts.slice(-k), counted[counted.length - 1]!.bar);
  }
  const driftPct = startBpm !== null && endBpm !== null && counted.length > 1 ? (endBpm / startBpm - 1) * 100 : null;

  const referenceBpm = options.referenceBpm ?? meanBpm;
  const regions = referenceBpm ? strayRegions(smoothed, ends, referenceBpm, tolerancePct) : [];
  const intended = marks.map((m) => {
    const inside = bars.filter((b) => overlaps(b.start, ends.get(b.bar) ?? b.start, [m]));
    return { ...m, firstBar: inside[0]?.bar ?? 0, lastBar: inside[inside.length - 1]?.bar ?? 0 };
  });
  return {
    bars,
    smoothed,
    referenceBpm: referenceBpm ?? null,
    startBpm,
    endBpm,
    driftPct,
    stabilityPct,
    meanBpm,
    regions,
    intended,
    windowBars,
    tolerancePct,
    countedBars: counted.length,
  };
}

/** Runs of consecutive smoothed bars beyond the tolerance on the same side; a gap in the bar numbers (a marked
 * bar) ends a run. */
function strayRegions(
  smoothed: BarTempo[],
  ends: Map<number, number>,
  referenceBpm: number,
  tolerancePct: number,
): TempoRegion[] {
  const side = (bpm: number) => {
    const off = (bpm / referenceBpm - 1) * 100;
    return off > tolerancePct ? 1 : off < -tolerancePct ? -1 : 0;
  };
  const out: TempoRegion[] = [];
  let run: BarTempo[] = [];
  const close = () => {
    if (run.length) {
      const first = run[0]!;
      const last = run[run.length - 1]!;
      const off = run.reduce((a, b) => a + (b.bpm / referenceBpm - 1) * 100, 0) / run.length;
      out.push({
        direction: off > 0 ? 'faster' : 'slower',
        firstBar: first.bar,
        lastBar: last.bar,
        startSec: first.start,
        endSec: ends.get(last.bar) ?? last.start,
        offPct: off,
      });
    }
    run = [];
  };
  for (const b of smoothed) {
    const s = side(b.bpm);
    const prev = run[run.length - 1];
    if (prev && (s !== side(prev.bpm) || b.bar !== prev.bar + 1)) close();
    if (s !== 0) run.push(b);
  }
  close();
  return out;
}

/** "bars 33–40" or "bar 9". */
export const barsInWords = (first: number, last: number) => (first === last ? `bar ${first}` : `bars ${first}–${last}`);

/** How many regions the summary names before it counts the rest. */
const SUMMARY_REGIONS = 2;

/**
 * The report in one line, as a musician would say it: "Starts at 152, ends at 158 — 4 % faster; rushes in bars
 * 33–40." Rushing and dragging are the trade's words for running ahead of and behind the beat (common practice).
 */
export function steadinessSummary(r: SteadinessReport): string {
  if (r.startBpm === null || r.endBpm === null || r.countedBars < 2)
    return 'Too few bars outside the marked passages to say how steady this is.';
  const whole = (bpm: number) => formatBpm(Math.round(bpm));
  const drift = Math.round(r.driftPct ?? 0);
  const driftWords = drift === 0 ? 'the same tempo' : `${Math.abs(drift)} % ${drift > 0 ? 'faster' : 'slower'}`;
  const head = `Starts at ${whole(r.startBpm)}, ends at ${whole(r.endBpm)} — ${driftWords}`;
  const named = r.regions
    .slice(0, SUMMARY_REGIONS)
    .map((g) => `${g.direction === 'faster' ? 'rushes' : 'drags'} in ${barsInWords(g.firstBar, g.lastBar)}`);
  const more = r.regions.length - named.length;
  if (more > 0) named.push(`${more} more ${more === 1 ? 'place' : 'places'} below`);
  const tail =
    named.length > 0
      ? named.join(', ')
      : r.referenceBpm
        ? `every bar within ${r.tolerancePct} % of ${whole(r.referenceBpm)}`
        : '';
  return `${head}${tail ? `; ${tail}` : ''}.`;
}

export interface TakeComparison {
  /** First beat to last beat of each, in seconds. */
  durationA: number;
  durationB: number;
  /** B − A. */
  durationDiffSec: number;
  meanA: number | null;
  meanB: number | null;
  /** B − A, in BPM and as a share of A in percent. */
  meanDiffBpm: number | null;
  meanDiffPct: number | null;
}

/** How two takes of one piece differ as a whole: how long each plays (first to last beat) and its mean tempo. */
export function compareTakes(a: { grid: Grid; report: SteadinessReport }, b: { grid: Grid; report: SteadinessReport }) {
  const span = (g: Grid) => (g.beats.length > 1 ? g.beats[g.beats.length - 1]! - g.beats[0]! : 0);
  const meanA = a.report.meanBpm;
  const meanB = b.report.meanBpm;
  const both = meanA !== null && meanB !== null;
  return {
    durationA: span(a.grid),
    durationB: span(b.grid),
    durationDiffSec: span(b.grid) - span(a.grid),
    meanA,
    meanB,
    meanDiffBpm: both ? meanB - meanA : null,
    meanDiffPct: both ? (meanB / meanA - 1) * 100 : null,
  } satisfies TakeComparison;
}
