// Songs from the library to add to a set list, found by title or composer as in the library.
import React, { useState } from 'react';
import { View } from 'react-native';
import { Body, Card, Chip, Field, Heading, Small } from '@/components/ui';
import { space } from '@/components/theme';
import { useSongs } from '@/client/hooks';
import { formatBpm } from '@/shared/format';

export function AddSongs({
  inList,
  busy,
  onAdd,
}: {
  inList: string[];
  busy: boolean;
  onAdd: (songId: string) => void;
}) {
  const [q, setQ] = useState('');
  const { songs } = useSongs({ q });
  const left = songs?.filter((s) => !inList.includes(s.id)) ?? [];
  return (
    <Card testID="add-songs">
      <Heading level={3}>Add songs</Heading>
      <Field label="Find a song" value={q} onChangeText={setQ} placeholder="Title, composer or artist" />
      {songs && left.length === 0 ? (
        <Small>{q.trim() ? 'No other song matches.' : 'Every song in your library is in this set list.'}</Small>
      ) : null}
      <View style={{ gap: space.xs }}>
        {left.map((song) => (
          <View
            key={song.id}
            style={{ flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm }}
          >
            <View style={{ flexShrink: 1 }}>
              <Body>{song.title}</Body>
              <Small>{song.chosenBpm ? `chosen ${formatBpm(song.chosenBpm)} BPM` : 'no chosen tempo yet'}</Small>
            </View>
            <Chip label="Add" hint={`Add ${song.title}`} disabled={busy} onPress={() => onAdd(song.id)} />
          </View>
        ))}
      </View>
    </Card>
  );
}
