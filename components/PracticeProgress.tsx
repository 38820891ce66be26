// A song's practice over days: one chart for the song (sessions on the whole piece or on loops) and one per
// saved passage that has sessions, each against its own goal and working tempo.
import React from 'react';
import { View } from 'react-native';
import { Heading } from './ui';
import { space } from './theme';
import { PracticeChart } from './charts/PracticeChart';
import { usePassages, usePractice } from '@/client/hooks';
import type { Song } from '@/shared/schemas';

export function PracticeProgress({ song }: { song: Song }) {
  const { entries } = usePractice(song.id);
  const { passages } = usePassages(song.id);
  if (!entries || entries.length === 0) return null;
  const onSong = entries.filter((e) => e.passageId === null);
  return (
    <View style={{ gap: space.md }} testID="practice-progress">
      <Heading level={3}>Tempo over days</Heading>
      {onSong.length > 0 ? (
        <PracticeChart title={song.title} sessions={onSong} tempos={song} testID="practice-chart-song" />
      ) : null}
      {(passages ?? []).map((p) => {
        const sessions = entries.filter((e) => e.passageId === p.id);
        return sessions.length > 0 ? (
          <PracticeChart
            key={p.id}
            title={`${song.title}: ${p.name}`}
            sessions={sessions}
            tempos={p}
            testID={`practice-chart-passage-${p.name}`}
          />
        ) : null;
      })}
    </View>
  );
}
