// The week's practice in numbers (ISO 8601 weeks, Monday first, in the player's local time): minutes, songs,
// and the tempo gained per song or passage; last week beside it. No streaks or badges: practising more is not
// the aim, practising well is.
import React, { useMemo } from 'react';
import { View } from 'react-native';
import { Body, Button, Card, Heading, Small } from './ui';
import { space } from './theme';
import { downloadPracticeLog, useMyPractice } from '@/client/hooks';
import {
  isoWeekOf,
  localDay,
  previousWeek,
  weekSummary,
  type WeekSummary as Week,
} from '@/audio/practice/practice-log';
import { formatBpm, formatDayNumber, formatMinutes, plural } from '@/shared/format';
import type { PracticeLogEntry } from '@/shared/schemas';

function WeekLines({ label, week, log }: { label: string; week: Week; log: PracticeLogEntry[] }) {
  const titles = new Map(log.map((e) => [e.songId, e.songTitle]));
  const range = `${formatDayNumber(week.from)} – ${formatDayNumber(week.to)}`;
  return (
    <View style={{ gap: space.xs }} testID={`week-${label === 'This week' ? 'this' : 'last'}`}>
      <Body style={{ fontWeight: '700' }}>
        {label} (week {week.week.week}, {range})
      </Body>
      {week.entries === 0 ? (
        <Small>No practice logged.</Small>
      ) : (
        <>
          <Small muted={false}>
            {formatMinutes(week.minutes)} · {plural(week.songs, 'song')} · {plural(week.entries, 'session')}
          </Small>
          {week.gains.length === 0 ? (
            <Small>No tempo gained on a clean session.</Small>
          ) : (
            week.gains.map((g) => (
              <Small key={`${g.songId}-${g.passageId ?? g.passage}`} muted={false}>
                {titles.get(g.songId)}
                {g.passage ? `, ${g.passage}` : ''}: {formatBpm(g.fromBpm)} → {formatBpm(g.toBpm)} BPM (+
                {formatBpm(Math.round((g.toBpm - g.fromBpm) * 10) / 10)})
              </Small>
            ))
          )}
        </>
      )}
    </View>
  );
}

export function WeekSummary() {
  const { entries } = useMyPractice();
  const weeks = useMemo(() => {
    if (!entries) return null;
    const thisWeek = isoWeekOf(localDay(new Date()));
    return { now: weekSummary(entries, thisWeek), before: weekSummary(entries, previousWeek(thisWeek)) };
  }, [entries]);
  if (!entries || !weeks) return null;
  return (
    <Card testID="week-summary">
      <Heading level={3}>Your week</Heading>
      <WeekLines label="This week" week={weeks.now} log={entries} />
      <WeekLines label="Last week" week={weeks.before} log={entries} />
      {entries.length > 0 ? (
        <Button label="Download the log (CSV)" kind="quiet" onPress={downloadPracticeLog} testID="export-csv" />
      ) : null}
    </Card>
  );
}
