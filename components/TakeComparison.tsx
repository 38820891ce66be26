// On the song screen: two recordings of the song (two takes, or a take and a reference) on one plot aligned by
// bar, with how much longer or shorter and faster or slower the second plays; and the player's last five takes
// as a small trend of drift and beat-to-beat variation. Each recording is read on the beat grid its owner
// feels, with its rubato and ritardando marks left out, as on the recording screen.
import React, { useMemo, useState } from 'react';
import { Text, View } from 'react-native';
import { Card, Chip, Heading, Small } from '@/components/ui';
import { colors, space, type } from '@/components/theme';
import { SteadinessTrendChart, TakeComparisonChart } from '@/components/charts/TakeComparisonChart';
import { useTempoMarksOf } from '@/client/hooks';
import { feltGrid } from '@/audio/practice/beat-grid';
import { beatsPerBar } from '@/audio/playback/click';
import { tempoByBar } from '@/audio/practice/tempo-by-bar';
import { compareTakes, steadiness, type SteadinessReport } from '@/audio/practice/steadiness';
import type { Grid } from '@/audio/practice/passage';
import { formatBpm, formatDate, formatDuration, tenth } from '@/shared/format';
import type { Recording, Song, TempoMark } from '@/shared/schemas';

/** How many takes the trend shows: enough to see a direction, few enough to read at a glance. */
const TREND_TAKES = 5;

/** A recording's beat grid as its owner feels it (level, bar one, nudge), or null before an analysis. */
export function feltGridOf(r: Recording, song: Song): Grid | null {
  const a = r.analysis;
  if (r.status !== 'done' || !a || r.originalBpm === null || a.beats.length < 2) return null;
  const felt = feltGrid(
    { beats: a.beats, downbeats: a.downbeats, bpm: r.originalBpm },
    { beatLevel: r.beatLevel, barOneSec: r.barOneSec, nudgeMs: r.nudgeMs },
    beatsPerBar(a.meter ?? song.meter ?? null),
  );
  return { beats: felt.beats, downbeats: felt.downbeats, durationSec: r.durationSec || a.durationSec };
}

const nameOf = (r: Recording) => r.label || r.originalName || (r.kind === 'take' ? 'Take' : 'Reference');

interface Read {
  r: Recording;
  grid: Grid;
  report: SteadinessReport;
}

export function TakeComparison({ song, recordings }: { song: Song; recordings: Recording[] }) {
  const usable = useMemo(
    () => recordings.filter((r) => feltGridOf(r, song) !== null).sort((x, y) => x.createdAt.localeCompare(y.createdAt)),
    [recordings, song],
  );
  const takes = usable.filter((r) => r.kind === 'take');
  // The two newest takes to begin with (or whatever two there are).
  const defaults = (takes.length >= 2 ? takes : usable).slice(-2).map((r) => r.id);
  const [picked, setPicked] = useState<[string | null, string | null]>([null, null]);
  const first = picked[0] ?? defaults[0] ?? null;
  const second = picked[1] ?? defaults[1] ?? null;
  const trendTakes = takes.slice(-TREND_TAKES);
  const ids = useMemo(
    () => [...new Set([first, second, ...trendTakes.map((r) => r.id)].filter((x): x is string => !!x))],
    [first, second, trendTakes],
  );
  const marks = useTempoMarksOf(ids);
  const read = (id: string | null): Read | null => {
    const r = usable.find((x) => x.id === id);
    const grid = r ? feltGridOf(r, song) : null;
    if (!r || !grid) return null;
    const intended: TempoMark[] = marks?.get(r.id) ?? [];
    return { r, grid, report: steadiness(grid, { referenceBpm: song.chosenBpm, intended }) };
  };

  if (usable.length < 2)
    return (
      <Card testID="take-comparison-card">
        <Heading level={3}>Compare recordings</Heading>
        <Small>Once two recordings of this song are analysed, you can lay one over the other here, bar by bar.</Small>
      </Card>
    );

  const a = read(first);
  const b = read(second);
  const label = (x: Read) => `${nameOf(x.r)} (${formatDate(x.r.createdAt)})`;
  const c = a && b && a.r.id !== b.r.id ? compareTakes(a, b) : null;
  const trend = trendTakes.map((r) => read(r.id)).filter((x): x is Read => x !== null);

  // One line per recording, newest first, with its two choices beside it: short on a phone with many takes.
  const choice = (slot: 0 | 1, r: Recording) => (
    <Chip
      label={slot === 0 ? 'A' : 'B'}
      compact
      selected={(slot === 0 ? first : second) === r.id}
      hint={`${nameOf(r)} as ${slot === 0 ? 'A, the solid line' : 'B, the dashed line'}`}
      onPress={() => setPicked(slot === 0 ? [r.id, second] : [first, r.id])}
      testID={`compare-${slot === 0 ? 'first' : 'second'}-${r.id}`}
    />
  );

  return (
    <Card testID="take-comparison-card">
      <Heading level={3}>Compare recordings</Heading>
      <Small>Pick A (solid line) and B (dashed line).</Small>
      <View style={{ gap: space.xs }} testID="compare-choices">
        {[...usable].reverse().map((r) => (
          <View key={r.id} style={{ flexDirection: 'row', alignItems: 'center', gap: space.sm }}>
            {choice(0, r)}
            {choice(1, r)}
            <Text style={[type.body, { color: colors.ink, flex: 1 }]} numberOfLines={1}>
              {nameOf(r)}
              <Text style={{ color: colors.muted }}> · {formatDate(r.createdAt)}</Text>
            </Text>
          </View>
        ))}
      </View>
      {a && b && c ? (
        <View style={{ gap: space.sm }}>
          <TakeComparisonChart
            a={{ label: label(a), bars: tempoByBar(a.grid) }}
            b={{ label: label(b), bars: tempoByBar(b.grid) }}
            song={song}
          />
          <Text style={[type.body, { color: colors.ink }]} testID="comparison-summary">
            {comparisonWords(c, nameOf(a.r), nameOf(b.r))}
          </Text>
          <Small>
            {nameOf(a.r)}: {formatDuration(c.durationA)}
            {c.meanA !== null ? `, ${formatBpm(tenth(c.meanA))} BPM on average` : ''} · {nameOf(b.r)}:{' '}
            {formatDuration(c.durationB)}
            {c.meanB !== null ? `, ${formatBpm(tenth(c.meanB))} BPM on average` : ''}. Bars are counted from each
            recording&apos;s bar 1.
          </Small>
        </View>
      ) : (
        <Small>Pick two different recordings.</Small>
      )}

      {trend.length >= 2 ? (
        <View style={{ gap: space.sm }} testID="trend">
          <Heading level={3}>The last {trend.length} takes</Heading>
          <SteadinessTrendChart
            points={trend.map((t, i) => ({
              n: i + 1,
              driftPct: t.report.driftPct,
              stabilityPct: t.report.stabilityPct,
            }))}
          />
          <Small>
            Oldest first: {trend.map((t) => formatDate(t.r.createdAt)).join(', ')}. Nearer 0 is steadier on both lines.
          </Small>
        </View>
      ) : null}
    </Card>
  );
}

/** "Against Take 1, Take 2 is 0:04 shorter and 3.2 BPM (2.6 %) faster on average." */
export function comparisonWords(c: ReturnType<typeof compareTakes>, first: string, second: string): string {
  const d = Math.round(c.durationDiffSec);
  const length = d === 0 ? 'the same length' : `${formatDuration(Math.abs(d))} ${d < 0 ? 'shorter' : 'longer'}`;
  const bpm = c.meanDiffBpm === null ? null : tenth(Math.abs(c.meanDiffBpm));
  const pace =
    bpm === null || c.meanDiffPct === null
      ? null
      : bpm === 0
        ? 'at the same tempo on average'
        : `${formatBpm(bpm)} BPM (${formatBpm(tenth(Math.abs(c.meanDiffPct)))} %) ${c.meanDiffBpm! > 0 ? 'faster' : 'slower'} on average`;
  return `Against ${first}, ${second} is ${length}${pace ? ` and ${pace}` : ''}.`;
}
