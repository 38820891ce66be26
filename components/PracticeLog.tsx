// A song's practice log: each session's passage, tempos, repetitions and minutes, newest first.
import React from 'react';
import { Text, View } from 'react-native';
import { Small } from './ui';
import { colors, space, type } from './theme';
import { formatBpm, formatDate, formatDateTime, formatMinutes, plural } from '@/shared/format';
import { loggedLater } from '@/audio/practice/practice-log';
import { usePractice } from '@/client/hooks';
import type { PracticeEntryDto } from '@/shared/schemas';

/** The bars an entry was played on, when it names them ("bars 57–60", "bar 3"). */
const bars = (e: PracticeEntryDto) =>
  e.startBar === null
    ? null
    : e.endBar === null || e.endBar === e.startBar
      ? `bar ${e.startBar}`
      : `bars ${e.startBar}–${e.endBar}`;

export function PracticeLog({ songId, limit = 5 }: { songId: string; limit?: number }) {
  const { entries } = usePractice(songId);
  if (!entries) return null;
  if (entries.length === 0)
    return (
      <Small>
        No practice logged yet. Log a session by hand, or finish a step-up run on a loop: it writes its entry here.
      </Small>
    );
  return (
    // Entries further apart than an entry's own lines, so each line's details read with its heading, not the next.
    <View style={{ gap: space.md }} testID="practice-log">
      {entries.slice(0, limit).map((e) => (
        <View
          key={e.id}
          style={{ flexDirection: 'row', flexWrap: 'wrap', columnGap: space.sm, rowGap: 2, alignItems: 'baseline' }}
        >
          <Text style={[type.label, { color: colors.ink }]}>
            {e.passage ?? 'Whole piece'}
            {bars(e) && bars(e) !== e.passage ? ` (${bars(e)})` : ''}:{' '}
            {e.startBpm === e.reachedBpm
              ? `at ${formatBpm(e.reachedBpm)} BPM`
              : `${formatBpm(e.startBpm)} → ${formatBpm(e.reachedBpm)} BPM`}
          </Text>
          <Small>
            {plural(e.repetitions, 'repetition')} · {formatMinutes(e.minutes)} · {e.clean ? 'clean' : 'not yet clean'} ·{' '}
            {loggedLater(e)
              ? `${formatDate(e.createdAt)} (logged ${formatDate(e.loggedAt)})`
              : formatDateTime(e.createdAt)}
          </Small>
          {e.note ? <Small muted={false}>“{e.note}”</Small> : null}
        </View>
      ))}
    </View>
  );
}
