// A song's practice log: each session's passage, tempos, repetitions and minutes, newest first.
import React from 'react';
import { Text, View } from 'react-native';
import { Small } from './ui';
import { colors, space, type } from './theme';
import { formatBpm, formatDate, plural } from '@/shared/format';
import { usePractice } from '@/client/hooks';

export function PracticeLog({ songId, limit = 5 }: { songId: string; limit?: number }) {
  const { entries } = usePractice(songId);
  if (!entries) return null;
  if (entries.length === 0) return <Small>No practice logged yet. A finished step-up run on a loop writes its entry here.</Small>;
  return (
    <View style={{ gap: space.xs }} testID="practice-log">
      {entries.slice(0, limit).map((e) => (
        <View key={e.id} style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'baseline' }}>
          <Text style={[type.label, { color: colors.ink }]}>
            {e.passage ?? 'Whole piece'}: {formatBpm(e.startBpm)} → {formatBpm(e.reachedBpm)} BPM
          </Text>
          <Small>
            {plural(e.repetitions, 'repetition')} · {e.minutes} min{e.clean ? ' · reached the goal' : ''} · {formatDate(e.createdAt)}
          </Small>
        </View>
      ))}
    </View>
  );
}
