import React from 'react';
import { Pressable, Text, View } from 'react-native';
import { useRouter } from 'expo-router';
import { Card, Small } from './ui';
import { SongTempos } from './TempoLabel';
import { ProgressToGoal } from './TempoProgress';
import { colors, radius, space, type } from './theme';
import { formatDate } from '@/shared/format';
import type { SongListItem } from '@/shared/schemas';

/** A song in the library on a phone: what it is, its tempos, how far toward the goal, when last practised. */
export function SongCard({ song }: { song: SongListItem }) {
  const router = useRouter();
  return (
    <Pressable
      role="link"
      accessibilityLabel={`Open ${song.title}`}
      onPress={() => router.navigate(`/songs/${song.id}`)}
    >
      <Card testID="song-card">
        <View style={{ flexDirection: 'row', justifyContent: 'space-between', flexWrap: 'wrap', gap: space.sm }}>
          <View style={{ flexShrink: 1 }}>
            <Text testID="library-song-title" style={[type.body, { fontWeight: '700', color: colors.ink }]}>
              {song.title}
            </Text>
            <Small>{[song.composer, song.key, song.meter].filter(Boolean).join(' · ')}</Small>
          </View>
          {song.ready ? (
            <Text
              style={[
                type.small,
                {
                  color: colors.teal,
                  backgroundColor: colors.tealSoft,
                  borderRadius: radius.sm,
                  paddingHorizontal: space.sm,
                  alignSelf: 'flex-start',
                },
              ]}
            >
              Ready to perform
            </Text>
          ) : null}
        </View>
        <SongTempos working={song.workingBpm} goal={song.goalBpm} chosen={song.chosenBpm} />
        {song.goalBpm !== null && !song.ready ? <ProgressToGoal working={song.workingBpm} goal={song.goalBpm} /> : null}
        <Small>
          {song.lastPractisedAt ? `Last practised ${formatDate(song.lastPractisedAt)}` : 'Not practised yet'}
        </Small>
      </Card>
    </Pressable>
  );
}
