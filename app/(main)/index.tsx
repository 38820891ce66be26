// Library: the songs this player is working on, with their tempos.
import React, { useState } from 'react';
import { View } from 'react-native';
import { plural } from '@/shared/format';
import { Button, EmptyState, Heading, Loading, Notice, Screen, Body } from '@/components/ui';
import { SongCard } from '@/components/SongCard';
import { SongForm } from '@/components/SongForm';
import { space } from '@/components/theme';
import { addSong, useSongs } from '@/client/hooks';
import { ScreenTitle } from '@/components/ScreenTitle';
import { TeachersCard } from '@/components/TeachersCard';

export default function Library() {
  const { songs, error, isLoading } = useSongs();
  const [adding, setAdding] = useState(false);

  return (
    <Screen testID="library">
      <ScreenTitle title="Library" />
      <View
        style={{
          flexDirection: 'row',
          justifyContent: 'space-between',
          alignItems: 'center',
          flexWrap: 'wrap',
          gap: space.md,
        }}
      >
        <Heading>Library</Heading>
        {songs?.length && !adding ? (
          <Button label="Add a song" kind="secondary" onPress={() => setAdding(true)} />
        ) : null}
      </View>
      <TeachersCard invitationsOnly />
      {error ? <Notice tone="error">Your songs could not be loaded: {error.message}</Notice> : null}
      {isLoading ? <Loading /> : null}
      {adding || (songs && songs.length === 0 && adding) ? (
        <SongForm
          onCancel={() => setAdding(false)}
          onSubmit={async (input) => {
            await addSong(input);
            setAdding(false);
          }}
        />
      ) : null}
      {songs && songs.length === 0 && !adding ? (
        <EmptyState
          title="Your library is empty"
          action={<Button label="Add your first song" onPress={() => setAdding(true)} testID="add-first-song" />}
        >
          Start with a piece you are working on now. Give it a goal tempo; next you will add a recording, hear it at
          other tempos with a click, and mark the tempo that feels right.
        </EmptyState>
      ) : null}
      {songs?.map((song) => (
        <SongCard key={song.id} song={song} />
      ))}
      {songs && songs.length > 0 ? <Body muted>{plural(songs.length, 'song')}</Body> : null}
    </Screen>
  );
}
