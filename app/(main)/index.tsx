// Library: the songs this player is working on, searched, sorted and filtered by the server; a table on a wide
// screen, cards on a phone.
import React, { useEffect, useState } from 'react';
import { useWindowDimensions, View } from 'react-native';
import { plural } from '@/shared/format';
import { Button, EmptyState, Heading, Loading, Notice, Screen, Body } from '@/components/ui';
import { SongCard } from '@/components/SongCard';
import { SongForm } from '@/components/SongForm';
import { LibraryControls } from '@/components/library/LibraryControls';
import { SongTable } from '@/components/library/SongTable';
import { layout, space } from '@/components/theme';
import { addSong, useSongs } from '@/client/hooks';
import { ScreenTitle } from '@/components/ScreenTitle';
import { TeachersCard } from '@/components/TeachersCard';
import type { LibrarySort, LibraryStatus } from '@/shared/schemas';

/** Typing pauses this long before the library is asked again, so each key press is not a request. */
const SEARCH_PAUSE_MS = 250;

export default function Library() {
  const [typed, setTyped] = useState('');
  const [q, setQ] = useState('');
  const [sort, setSort] = useState<LibrarySort>('title');
  const [status, setStatus] = useState<LibraryStatus | null>(null);
  useEffect(() => {
    const t = setTimeout(() => setQ(typed), SEARCH_PAUSE_MS);
    return () => clearTimeout(t);
  }, [typed]);
  const narrowed = q.trim() !== '' || status !== null;
  const { songs, error, isLoading } = useSongs({ q, sort, status: status ?? undefined });
  const [adding, setAdding] = useState(false);
  const wide = useWindowDimensions().width >= layout.wideFrom;
  const libraryEmpty = songs?.length === 0 && !narrowed;

  return (
    <Screen testID="library" wide>
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
        {!libraryEmpty && songs && !adding ? (
          <Button label="Add a song" kind="secondary" onPress={() => setAdding(true)} />
        ) : null}
      </View>
      <TeachersCard invitationsOnly />
      {error ? <Notice tone="error">Your songs could not be loaded: {error.message}</Notice> : null}
      {isLoading ? <Loading /> : null}
      {adding ? (
        <SongForm
          onCancel={() => setAdding(false)}
          onSubmit={async (input) => {
            await addSong(input);
            setAdding(false);
          }}
        />
      ) : null}
      {libraryEmpty && !adding ? (
        <EmptyState
          title="Your library is empty"
          action={<Button label="Add your first song" onPress={() => setAdding(true)} testID="add-first-song" />}
        >
          Start with a piece you are working on now. Give it a goal tempo; next you will add a recording, hear it at
          other tempos with a click, and mark the tempo that feels right.
        </EmptyState>
      ) : null}
      {songs && !libraryEmpty ? (
        <>
          <LibraryControls q={typed} onQ={setTyped} sort={sort} onSort={setSort} status={status} onStatus={setStatus} />
          {songs.length === 0 ? (
            <EmptyState
              title="No song matches"
              action={
                <Button
                  label="Show all songs"
                  kind="secondary"
                  onPress={() => {
                    setTyped('');
                    setQ('');
                    setStatus(null);
                  }}
                  testID="show-all-songs"
                />
              }
            >
              {q.trim() ? `Nothing in your library has “${q.trim()}” in its title or composer. ` : ''}
              {status === 'ready'
                ? 'No song is ready to perform yet.'
                : status === 'learning'
                  ? 'Every song is ready to perform.'
                  : ''}
            </EmptyState>
          ) : wide ? (
            <SongTable songs={songs} />
          ) : (
            songs.map((song) => <SongCard key={song.id} song={song} />)
          )}
          <Body muted>{narrowed ? `${plural(songs.length, 'song')} shown` : plural(songs.length, 'song')}</Body>
        </>
      ) : null}
    </Screen>
  );
}
