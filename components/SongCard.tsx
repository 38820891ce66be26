import React from 'react';
import { Pressable, View } from 'react-native';
import { useRouter } from 'expo-router';
import { Body, Card, Small } from './ui';
import { SongTempos } from './TempoLabel';
import { space } from './theme';
import type { Song } from '@/shared/schemas';

export function SongCard({ song }: { song: Song }) {
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
            <Body style={{ fontWeight: '700' }}>{song.title}</Body>
            <Small>{[song.composer, song.meter].filter(Boolean).join(' · ')}</Small>
          </View>
        </View>
        <SongTempos working={song.workingBpm} goal={song.goalBpm} chosen={song.chosenBpm} />
      </Card>
    </Pressable>
  );
}
