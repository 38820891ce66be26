// Two recordings' tempo by bar on one plot, aligned by bar number, against the song's tempo lines; and the
// drift and beat-to-beat variation of the last few takes as a small trend. Both drawn with LineChart.
import React, { useMemo } from 'react';
import type { BarTempo } from '@/audio/practice/tempo-by-bar';
import { formatBpm } from '@/shared/format';
import { colors } from '@/components/theme';
import type { Song } from '@/shared/schemas';
import { LineChart, type Series } from './LineChart';
import { referenceLines } from './TempoCurveChart';

const BAR_TICK_STEPS = [1, 2, 4, 8, 16, 32, 64, 128, 256, 512];
const wholeBpm = (v: number) => formatBpm(Math.round(v));
/** Least room above and below, in BPM, so two steady takes are not drawn as jagged ones. */
const MIN_PAD_BPM = 3;

export function TakeComparisonChart({
  a,
  b,
  song,
  height = 220,
}: {
  a: { label: string; bars: BarTempo[] };
  b: { label: string; bars: BarTempo[] };
  song?: Pick<Song, 'chosenBpm' | 'goalBpm' | 'workingBpm'> | null;
  height?: number;
}) {
  const refs = useMemo(() => referenceLines(song), [song]);
  const series = useMemo(
    (): Series[] => [
      { id: 'first', label: a.label, points: a.bars.map((x) => ({ x: x.bar, y: x.bpm })), color: colors.teal },
      {
        id: 'second',
        label: b.label,
        points: b.bars.map((x) => ({ x: x.bar, y: x.bpm })),
        color: colors.amber,
        dash: '7 4',
      },
    ],
    [a, b],
  );
  const ys = [...a.bars, ...b.bars].map((x) => x.bpm).concat(refs.map((r) => r.y));
  const lo = Math.min(...ys);
  const hi = Math.max(...ys);
  const pad = Math.max(MIN_PAD_BPM, (hi - lo) * 0.1);
  const last = Math.max(1, ...[...a.bars, ...b.bars].map((x) => x.bar));
  return (
    <LineChart
      series={series}
      referenceLines={refs}
      xDomain={[1, last]}
      yDomain={[lo - pad, hi + pad]}
      xTickSteps={BAR_TICK_STEPS}
      xTickOrigin={1}
      formatY={wholeBpm}
      xLabel="bar"
      yLabel="BPM"
      height={height}
      accessibilityLabel={`Tempo by bar of ${a.label} and ${b.label}, aligned by bar.`}
      testID="take-comparison"
    />
  );
}

export interface TrendPoint {
  /** 1 = the oldest shown. */
  n: number;
  driftPct: number | null;
  stabilityPct: number | null;
}

/** Drift and beat-to-beat variation of the last takes, oldest first, in percent. */
export function SteadinessTrendChart({ points, height = 160 }: { points: TrendPoint[]; height?: number }) {
  const series = useMemo(
    (): Series[] => [
      {
        id: 'drift',
        label: 'drift %',
        points: points.map((p) => ({ x: p.n, y: p.driftPct ?? NaN })),
        color: colors.amber,
      },
      {
        id: 'variation',
        label: 'beat-to-beat variation %',
        points: points.map((p) => ({ x: p.n, y: p.stabilityPct ?? NaN })),
        color: colors.teal,
        dash: '7 4',
      },
    ],
    [points],
  );
  const ys = points.flatMap((p) => [p.driftPct, p.stabilityPct]).filter((y): y is number => y !== null);
  return (
    <LineChart
      series={series}
      referenceLines={[{ y: 0, label: '0 %', color: colors.muted, dash: '2 4' }]}
      yDomain={[Math.min(0, ...ys) - 1, Math.max(0, ...ys) + 1]}
      xDomain={[1, Math.max(2, points.length)]}
      integerX
      formatX={(x) => `take ${x}`}
      formatY={(y) => `${formatBpm(Math.round(y * 10) / 10)}`}
      yLabel="%"
      height={height}
      accessibilityLabel={`Drift and beat-to-beat variation of the last ${points.length} takes, oldest first.`}
      testID="steadiness-trend"
    />
  );
}
