// The steadiness report of a recording, on the tempo curve: a plain summary, start and end tempo, drift and
// beat-to-beat variation, the bars that rush or drag beyond the player's tolerance (each one tap from looping),
// and the stretches marked rubato or ritardando (left out of every figure). Computed here from the beat grid the
// player feels (audio/practice/steadiness.ts): it is cheap, and a change of window, tolerance or beat level
// redraws it at once. A take shows it at once; a reference on request.
import React, { useMemo, useState } from 'react';
import { Text, View } from 'react-native';
import { Button, Chip, Notice, Row, Small } from '@/components/ui';
import { colors, radius, space, type } from '@/components/theme';
import { TempoCurveChart } from '@/components/charts/TempoCurveChart';
import type { XRange } from '@/components/charts/LineChart';
import { addTempoMark, removeTempoMark, useTempoMarks } from '@/client/hooks';
import {
  barsInWords,
  DEFAULT_TOLERANCE_PCT,
  DEFAULT_WINDOW_BARS,
  steadiness,
  steadinessSummary,
  TOLERANCE_CHOICES,
  WINDOW_CHOICES,
  type SteadinessReport as Report,
} from '@/audio/practice/steadiness';
import type { Grid, Passage as Region } from '@/audio/practice/passage';
import { formatBpm, formatClock, tenth } from '@/shared/format';
import type { Recording, Song, TempoMark } from '@/shared/schemas';

const KIND_WORDS: Record<TempoMark['kind'], string> = { rubato: 'rubato', ritardando: 'ritardando' };
const signedPct = (pct: number) => `${pct > 0 ? '+' : pct < 0 ? '−' : ''}${formatBpm(tenth(Math.abs(pct)))} %`;
const whole = (bpm: number) => formatBpm(Math.round(bpm));

/** Bands on the chart: a bar n spans n − ½ … n + ½ on the bar axis. */
export function reportRanges(r: Report): XRange[] {
  return [
    ...r.intended
      .filter((m) => m.firstBar > 0)
      .map((m) => ({
        from: m.firstBar - 0.5,
        to: m.lastBar + 0.5,
        label: m.kind === 'rubato' ? 'rubato' : 'rit.',
        color: colors.tealSoft,
      })),
    ...r.regions.map((g) => ({
      from: g.firstBar - 0.5,
      to: g.lastBar + 0.5,
      label: g.direction === 'faster' ? 'rushes' : 'drags',
      color: g.direction === 'faster' ? colors.amberSoft : colors.dangerSoft,
    })),
  ];
}

function Figure({ label, value, testID }: { label: string; value: string; testID?: string }) {
  return (
    <View style={{ minWidth: 96, gap: 2 }}>
      <Small>{label}</Small>
      <Text style={[type.h3, { color: colors.ink }]} testID={testID}>
        {value}
      </Text>
    </View>
  );
}

export function SteadinessReport({
  recording,
  song,
  grid,
  canEdit,
  loop,
  loopLabel,
  onLoop,
}: {
  recording: Recording;
  song: Song | undefined;
  /** The beat grid as the player feels it. */
  grid: Grid;
  canEdit: boolean;
  /** The loop being played, which the owner can mark as rubato or ritardando. */
  loop: Region | null;
  loopLabel: string | null;
  onLoop: (start: number, end: number) => void;
}) {
  const [shown, setShown] = useState(recording.kind === 'take');
  const [windowBars, setWindowBars] = useState<number>(DEFAULT_WINDOW_BARS);
  const [tolerancePct, setTolerancePct] = useState<number>(DEFAULT_TOLERANCE_PCT);
  const chosen = song?.chosenBpm ?? null;
  const [againstChosen, setAgainstChosen] = useState(true);
  const { marks } = useTempoMarks(recording.id);
  const report = useMemo(
    () =>
      steadiness(grid, {
        referenceBpm: againstChosen ? chosen : null,
        windowBars,
        tolerancePct,
        intended: marks ?? [],
      }),
    [grid, againstChosen, chosen, windowBars, tolerancePct, marks],
  );
  const [markError, setMarkError] = useState<string | null>(null);
  const addMark = (kind: TempoMark['kind']) => {
    if (!loop) return;
    setMarkError(null);
    addTempoMark(recording.id, { kind, startSec: loop.start, endSec: loop.end }).catch((e: Error) =>
      setMarkError(e.message),
    );
  };
  const remove = (m: TempoMark) => removeTempoMark(recording.id, m.id).catch((e: Error) => setMarkError(e.message));

  const smoothedLabel = windowBars === 1 ? 'each bar' : `smoothed over ${windowBars} bars`;
  const chart = (
    <TempoCurveChart
      analysis={grid}
      song={song}
      overlay={
        shown
          ? {
              smoothed: windowBars > 1 ? { label: smoothedLabel, bars: report.smoothed } : undefined,
              ranges: reportRanges(report),
              caption: `Tempo by bar${windowBars > 1 ? `; the dashed line is ${smoothedLabel}` : ''}.`,
            }
          : undefined
      }
    />
  );
  if (!shown)
    return (
      <View style={{ gap: space.md }} testID="steadiness-report">
        {chart}
        <Button
          label="Show the steadiness report"
          kind="secondary"
          onPress={() => setShown(true)}
          testID="show-steadiness"
        />
      </View>
    );

  const reference = report.referenceBpm;
  return (
    <View style={{ gap: space.md }} testID="steadiness-report">
      <Text style={[type.body, { color: colors.ink, fontFamily: type.label.fontFamily }]} testID="steadiness-summary">
        {steadinessSummary(report)}
      </Text>
      <Row gap={space.lg} align="flex-start">
        <Figure
          label="Starts at"
          value={report.startBpm === null ? '–' : `${whole(report.startBpm)} BPM`}
          testID="steadiness-start"
        />
        <Figure
          label="Ends at"
          value={report.endBpm === null ? '–' : `${whole(report.endBpm)} BPM`}
          testID="steadiness-end"
        />
        <Figure
          label="Drift"
          value={report.driftPct === null ? '–' : signedPct(report.driftPct)}
          testID="steadiness-drift"
        />
        <Figure
          label="Beat-to-beat variation"
          value={report.stabilityPct === null ? '–' : `${formatBpm(tenth(report.stabilityPct))} %`}
          testID="steadiness-stability"
        />
      </Row>
      <Small>
        Drift compares the tempo of the first and last four bars. Beat-to-beat variation is how much the tempo moves
        from one beat to the next (the coefficient of variation; a click track would read 0 %).
      </Small>
      {chart}

      <View style={{ gap: space.xs }}>
        <Text style={[type.label, { color: colors.muted }]}>Smoothing</Text>
        <Row>
          {WINDOW_CHOICES.map((n) => (
            <Chip
              key={n}
              label={n === 1 ? 'none' : `${n} bars`}
              selected={windowBars === n}
              onPress={() => setWindowBars(n)}
              testID={`smoothing-${n}`}
            />
          ))}
        </Row>
        <Text style={[type.label, { color: colors.muted }]}>Flag bars more than</Text>
        <Row>
          {TOLERANCE_CHOICES.map((n) => (
            <Chip
              key={n}
              label={`±${n} %`}
              selected={tolerancePct === n}
              onPress={() => setTolerancePct(n)}
              testID={`tolerance-${n}`}
            />
          ))}
        </Row>
        {chosen !== null ? (
          <>
            <Text style={[type.label, { color: colors.muted }]}>away from</Text>
            <Row>
              <Chip
                label={`chosen tempo ${formatBpm(chosen)}`}
                selected={againstChosen}
                onPress={() => setAgainstChosen(true)}
                testID="against-chosen"
              />
              <Chip
                label={`this take's own${report.meanBpm ? ` ${whole(report.meanBpm)}` : ''}`}
                selected={!againstChosen}
                onPress={() => setAgainstChosen(false)}
                testID="against-own"
              />
            </Row>
          </>
        ) : (
          <Small>
            Away from this recording&apos;s own tempo{reference ? ` (${whole(reference)} BPM)` : ''}; choose a tempo for
            the song to measure against that instead.
          </Small>
        )}
      </View>

      <View style={{ gap: space.sm }} testID="steadiness-regions">
        <Text style={[type.label, { color: colors.muted }]}>Where it strays</Text>
        {report.regions.length === 0 ? (
          <Small>
            No stretch strays more than {tolerancePct} %{reference ? ` from ${whole(reference)}` : ''}.
          </Small>
        ) : null}
        {report.regions.map((g) => (
          <View
            key={`${g.firstBar}-${g.direction}`}
            testID={`region-${g.firstBar}`}
            style={{
              flexDirection: 'row',
              flexWrap: 'wrap',
              alignItems: 'center',
              gap: space.sm,
              padding: space.sm,
              borderRadius: radius.sm,
              backgroundColor: g.direction === 'faster' ? colors.amberSoft : colors.dangerSoft,
            }}
          >
            <Text style={[type.label, { color: colors.ink, flexGrow: 1, flexShrink: 1 }]}>
              {g.direction === 'faster' ? 'Rushes' : 'Drags'} in {barsInWords(g.firstBar, g.lastBar)} ·{' '}
              {formatClock(g.startSec)}–{formatClock(g.endSec)} · {signedPct(g.offPct)}
            </Text>
            <Chip
              label="Loop"
              hint={`Loop ${barsInWords(g.firstBar, g.lastBar)}`}
              onPress={() => onLoop(g.startSec, g.endSec)}
              testID={`loop-region-${g.firstBar}`}
            />
          </View>
        ))}
      </View>

      <View style={{ gap: space.sm }} testID="tempo-marks">
        <Text style={[type.label, { color: colors.muted }]}>Meant to move</Text>
        {(marks ?? []).length === 0 ? (
          <Small>
            {canEdit
              ? 'Played a passage freely or slowing down on purpose? Loop it and mark it: it is then left out of drift and variation.'
              : 'No passages are marked as rubato or ritardando.'}
          </Small>
        ) : null}
        {(marks ?? []).map((m) => {
          const bars = report.intended.find((i) => i.startSec === m.startSec && i.endSec === m.endSec);
          return (
            <Row key={m.id}>
              <Text style={[type.body, { color: colors.ink }]} testID={`marked-${m.kind}`}>
                {KIND_WORDS[m.kind]} ·{' '}
                {bars && bars.firstBar > 0 ? `${barsInWords(bars.firstBar, bars.lastBar)} · ` : ''}
                {formatClock(m.startSec)}–{formatClock(m.endSec)}
              </Text>
              <Chip label="Loop" onPress={() => onLoop(m.startSec, m.endSec)} />
              {canEdit ? <Chip label="Remove" onPress={() => void remove(m)} testID={`remove-mark-${m.id}`} /> : null}
            </Row>
          );
        })}
        {canEdit && loop && !(marks ?? []).some((m) => m.startSec === loop.start && m.endSec === loop.end) ? (
          <Row>
            <Text style={[type.label, { color: colors.ink }]}>Mark {loopLabel ?? 'the loop'} as</Text>
            <Chip label="rubato" onPress={() => addMark('rubato')} testID="mark-rubato" />
            <Chip label="ritardando" onPress={() => addMark('ritardando')} testID="mark-ritardando" />
          </Row>
        ) : null}
        {markError ? <Notice tone="error">{markError}</Notice> : null}
      </View>
    </View>
  );
}
