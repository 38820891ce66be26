// A recording's tempo bar by bar, against the song's chosen, goal and working tempos, with a one-line caption
// that says in words how it starts and ends.
import React, { useMemo } from 'react';
import { View } from 'react-native';
import type { Analysis } from '@/shared/analysis';
import type { Song } from '@/shared/schemas';
import { smoothTempo, tempoByBar, type BarTempo } from '@/audio/practice/tempo-by-bar';
import { formatBpm, plural } from '@/shared/format';
import { Small } from '@/components/ui';
import { colors, space } from '@/components/theme';
import { LineChart, type ReferenceLine, type Series, type XRange } from './LineChart';

type SongTempos = Pick<Song, 'chosenBpm' | 'goalBpm' | 'workingBpm'>;

/** The caption's start and end are medians over this many bars at each end (a window of 5 centred on the first
 * bar sees bars 1–3): one stray bar does not decide how a take "starts". */
const CAPTION_WINDOW_BARS = 5;
/** Least room above and below the data and lines, in BPM: a steady take is not drawn as a jagged one. */
const MIN_PAD_BPM = 3;
/** Room above and below as a share of the span, so the extremes do not sit on the frame. */
const PAD_SHARE = 0.1;

/** Bar numbers are labelled by phrase, from bar 1: every bar, 2, 4, 8 … bars, the smallest that fits (music is
 * mostly phrased in 4 and 8 bars, common practice, so 1, 5, 9, 13 reads as the phrase starts). */
const BAR_TICK_STEPS = [1, 2, 4, 8, 16, 32, 64, 128, 256, 512];
const wholeBpm = (v: number) => formatBpm(Math.round(v));

/** Each tempo line keeps its own colour and dash; equal tempos share one line with both names. */
const LINE_STYLES = {
  chosen: { color: colors.amber, dash: undefined },
  goal: { color: colors.tealDark, dash: '6 4' },
  working: { color: colors.muted, dash: '2 4' },
} as const;

export function referenceLines(song: SongTempos | null | undefined): ReferenceLine[] {
  if (!song) return [];
  const named: { name: keyof typeof LINE_STYLES; bpm: number | null }[] = [
    { name: 'chosen', bpm: song.chosenBpm },
    { name: 'goal', bpm: song.goalBpm },
    { name: 'working', bpm: song.workingBpm },
  ];
  const byTempo = new Map<number, (keyof typeof LINE_STYLES)[]>();
  for (const { name, bpm } of named) if (bpm !== null) byTempo.set(bpm, [...(byTempo.get(bpm) ?? []), name]);
  // The first name's style wins: chosen over goal over working.
  return [...byTempo].map(([bpm, names]) => ({
    y: bpm,
    label: `${names.join(' · ')} ${formatBpm(bpm)}`,
    ...LINE_STYLES[names[0]!],
  }));
}

/** "Tempo by bar: starts at 122, ends at 126" — or what there is to say when there is little. */
export function tempoCaption(bars: BarTempo[]): string {
  if (bars.length === 0) return 'No bars were found in this recording, so there is no tempo curve to draw.';
  const round = (bpm: number) => formatBpm(Math.round(bpm));
  if (bars.length === 1) return `Tempo by bar: one bar, at ${round(bars[0]!.bpm)}`;
  const smooth = smoothTempo(bars, CAPTION_WINDOW_BARS);
  return `Tempo by bar: starts at ${round(smooth[0]!.bpm)}, ends at ${round(smooth[smooth.length - 1]!.bpm)} (${plural(bars.length, 'bar')})`;
}

/**
 * The steadiness report draws on the same chart: the bars smoothed over its window as a second line, the bars that
 * rush or drag and the marked rubato as labelled bands, and its own caption.
 */
export interface TempoCurveOverlay {
  smoothed?: { label: string; bars: BarTempo[] };
  ranges?: XRange[];
  caption?: string;
}

export function TempoCurveChart({
  analysis,
  song,
  height = 220,
  overlay,
}: {
  analysis: Pick<Analysis, 'beats' | 'downbeats' | 'durationSec'> | null | undefined;
  song?: SongTempos | null;
  height?: number;
  overlay?: TempoCurveOverlay;
}) {
  const bars = useMemo(() => (analysis ? tempoByBar(analysis) : []), [analysis]);
  const refs = useMemo(() => referenceLines(song), [song]);
  const smoothed = overlay?.smoothed;
  const series = useMemo((): Series[] => {
    const raw: Series = {
      id: 'tempo',
      label: 'tempo by bar',
      points: bars.map((b) => ({ x: b.bar, y: b.bpm })),
      color: colors.teal,
      width: smoothed ? 1.5 : 2,
    };
    if (!smoothed) return [raw];
    // A bar left out (marked rubato) is a gap in the smoothed line, not a slope across it.
    const byBar = new Map(smoothed.bars.map((b) => [b.bar, b.bpm]));
    const points = bars.map((b) => ({ x: b.bar, y: byBar.get(b.bar) ?? NaN }));
    return [raw, { id: 'smoothed', label: smoothed.label, points, color: colors.tealDark, width: 3, dash: '8 3' }];
  }, [bars, smoothed]);
  const yDomain = useMemo((): [number, number] => {
    const ys = [...bars.map((b) => b.bpm), ...refs.map((r) => r.y)];
    const lo = Math.min(...ys);
    const hi = Math.max(...ys);
    const pad = Math.max(MIN_PAD_BPM, (hi - lo) * PAD_SHARE);
    return [lo - pad, hi + pad];
  }, [bars, refs]);

  if (!analysis) return <Small>The tempo curve appears here once the analysis is done.</Small>;
  const caption = bars.length === 0 ? tempoCaption(bars) : (overlay?.caption ?? tempoCaption(bars));
  if (bars.length === 0) return <Small>{caption}</Small>;

  const lines = refs.map((r) => r.label).join(', ');
  const summary = `${caption}.${lines ? ` Lines: ${lines}.` : ''}`;
  return (
    <View style={{ gap: space.sm }} testID="tempo-curve-chart">
      <LineChart
        series={series}
        referenceLines={refs}
        ranges={overlay?.ranges}
        xDomain={bars.length > 1 ? [bars[0]!.bar, bars[bars.length - 1]!.bar] : undefined}
        yDomain={yDomain}
        xTickSteps={BAR_TICK_STEPS}
        xTickOrigin={1}
        formatY={wholeBpm}
        xLabel="bar"
        yLabel="BPM"
        height={height}
        accessibilityLabel={summary}
        testID="tempo-curve"
      />
      <Small muted={false}>{caption}</Small>
    </View>
  );
}
