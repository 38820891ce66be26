// Tempo reached over days for a song or one of its passages, against its goal and working tempo, with a caption
// that says in words how many sessions it shows and where the last one got to.
import React, { useMemo } from 'react';
import { View } from 'react-native';
import { tempoOverDays, type LoggedSession } from '@/audio/practice/practice-log';
import { formatBpm, formatDayNumber, plural } from '@/shared/format';
import { Small } from '@/components/ui';
import { colors, space } from '@/components/theme';
import { LineChart } from './LineChart';
import { referenceLines } from './TempoCurveChart';

/** Day ticks every day, 2 days, a week, 2 weeks …; weeks counted from a Monday (1970-01-05, day 4) so weekly
 * ticks fall on the first day of the ISO week. */
const DAY_TICK_STEPS = [1, 2, 7, 14, 28, 56, 112, 364];
const FIRST_MONDAY = 4;
/** Room above and below the tempos, in BPM, so a point on the goal line does not sit on the frame. */
const PAD_BPM = 4;

export function practiceCaption(sessions: { y: number; clean: boolean; x: number }[]): string {
  if (sessions.length === 0) return 'No sessions logged here yet.';
  const last = sessions[sessions.length - 1]!;
  const days = new Set(sessions.map((s) => Math.floor(s.x))).size;
  return `${plural(sessions.length, 'session')} over ${plural(days, 'day')}; the last reached ${formatBpm(last.y)} BPM${last.clean ? ', clean' : ', not yet clean'}`;
}

export function PracticeChart({
  title,
  sessions,
  tempos,
  height = 200,
  testID,
}: {
  title: string;
  sessions: LoggedSession[];
  tempos: { workingBpm: number | null; goalBpm: number | null };
  height?: number;
  testID?: string;
}) {
  const points = useMemo(() => tempoOverDays(sessions), [sessions]);
  const refs = useMemo(
    () => referenceLines({ chosenBpm: null, goalBpm: tempos.goalBpm, workingBpm: tempos.workingBpm }),
    [tempos.goalBpm, tempos.workingBpm],
  );
  const caption = practiceCaption(points);
  // Clean sessions are the progress line; sessions not yet clean are drawn apart, dashed and muted, so a fast
  // but messy run does not read as progress.
  const series = useMemo(
    () =>
      [
        { id: 'clean', label: 'clean', points: points.filter((p) => p.clean), color: colors.teal },
        {
          id: 'not-clean',
          label: 'not yet clean',
          points: points.filter((p) => !p.clean),
          color: colors.muted,
          dash: '3 3',
        },
      ].filter((s) => s.points.length > 0),
    [points],
  );
  if (points.length === 0) return null;
  const ys = [...points.map((p) => p.y), ...refs.map((r) => r.y)];
  // Ends at the last session, never later: a practice chart has no days to come. At least a week wide, reaching
  // back, so one day's sessions do not stretch across the whole chart.
  const last = points[points.length - 1]!.x;
  const first = Math.min(Math.floor(points[0]!.x), Math.floor(last) - 7);
  return (
    <View style={{ gap: space.xs }} testID={testID}>
      <Small muted={false}>{title}</Small>
      <LineChart
        series={series}
        referenceLines={refs}
        xDomain={[first, last]}
        yDomain={[Math.min(...ys) - PAD_BPM, Math.max(...ys) + PAD_BPM]}
        xTickSteps={DAY_TICK_STEPS}
        xTickOrigin={FIRST_MONDAY}
        formatX={(x) => formatDayNumber(x)}
        formatY={(y) => formatBpm(Math.round(y))}
        yLabel="BPM"
        height={height}
        accessibilityLabel={`${title}: ${caption}.`}
      />
      <Small>{caption}.</Small>
    </View>
  );
}
