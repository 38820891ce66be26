// One set list: its songs in playing order at their chosen tempos, each song's length and the total; rename,
// reorder, add and take out songs, open the stage view, delete.
import React, { useState } from 'react';
import { Text, View } from 'react-native';
import { useLocalSearchParams, useRouter } from 'expo-router';
import { Body, Button, Card, EmptyState, Field, Heading, Loading, Notice, Row, Screen } from '@/components/ui';
import { ScreenTitle } from '@/components/ScreenTitle';
import { colors, fonts, space, type } from '@/components/theme';
import { changeSetList, deleteSetList, useSetList } from '@/client/hooks';
import { SetListSongs } from '@/components/setlists/SetListSongs';
import { AddSongs } from '@/components/setlists/AddSongs';
import { totalLength } from '@/components/setlists/lengths';

export default function SetListScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const router = useRouter();
  const { setList, error, isLoading } = useSetList(id);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [renaming, setRenaming] = useState<string | null>(null);
  const [confirmDelete, setConfirmDelete] = useState(false);

  const run = async (work: () => Promise<unknown>) => {
    setBusy(true);
    setProblem(null);
    try {
      await work();
    } catch (e) {
      setProblem((e as Error).message);
    } finally {
      setBusy(false);
    }
  };

  if (error) {
    return (
      <Screen>
        <Button label="‹ Set lists" kind="quiet" onPress={() => router.navigate('/set-lists')} />
        <Notice tone="error">This set list could not be found: {error.message}</Notice>
      </Screen>
    );
  }
  if (isLoading || !setList) return <Loading />;
  const ids = setList.songs.map((s) => s.songId);

  return (
    <Screen testID="set-list">
      <ScreenTitle title={setList.name} />
      <Button label="‹ Set lists" kind="quiet" onPress={() => router.navigate('/set-lists')} />
      {renaming === null ? (
        <View style={{ gap: space.xs }}>
          <Heading>{setList.name}</Heading>
          <Text style={[type.body, { color: colors.ink, fontFamily: fonts.bodyBold }]} testID="set-list-total">
            {totalLength(setList)}
          </Text>
        </View>
      ) : (
        <Card>
          <Field label="Name" value={renaming} onChangeText={setRenaming} testID="set-list-rename" />
          <Row>
            <Button
              label="Save the name"
              busy={busy}
              onPress={() =>
                run(async () => {
                  await changeSetList(setList.id, { name: renaming });
                  setRenaming(null);
                })
              }
              testID="save-set-list-name"
            />
            <Button label="Cancel" kind="quiet" onPress={() => setRenaming(null)} />
          </Row>
        </Card>
      )}
      {problem ? <Notice tone="error">{problem}</Notice> : null}
      <Row>
        <Button
          label="Stage view"
          onPress={() => router.navigate(`/stage/${setList.id}`)}
          disabled={setList.songs.length === 0}
          testID="open-stage-view"
        />
        {renaming === null ? (
          <Button label="Rename" kind="secondary" onPress={() => setRenaming(setList.name)} />
        ) : null}
      </Row>
      {setList.songs.length === 0 ? (
        <EmptyState title="No songs in this set list yet">
          Add songs below in the order you will play them; you can move them up and down afterwards.
        </EmptyState>
      ) : (
        <SetListSongs
          list={setList}
          busy={busy}
          onOrder={(songIds) => run(() => changeSetList(setList.id, { songIds }))}
        />
      )}
      {setList.unknownDurations > 0 || setList.estimatedDurations > 0 ? (
        <Body muted>
          A song&apos;s length is its analysed recording&apos;s beats played at its chosen tempo; until a tempo is
          chosen, at the tempo the recording was analysed at (≈, an estimate). Add a recording to count a song in the
          total, and choose its tempo to make the total exact.
        </Body>
      ) : null}
      <AddSongs
        inList={ids}
        busy={busy}
        onAdd={(songId) => run(() => changeSetList(setList.id, { songIds: [...ids, songId] }))}
      />
      {confirmDelete ? (
        <Card>
          <Body>Delete “{setList.name}”? The songs stay in your library.</Body>
          <Row>
            <Button
              label="Delete the set list"
              kind="danger"
              busy={busy}
              onPress={() =>
                run(async () => {
                  await deleteSetList(setList.id);
                  router.replace('/set-lists');
                })
              }
              testID="confirm-delete-set-list"
            />
            <Button label="Keep it" kind="quiet" onPress={() => setConfirmDelete(false)} />
          </Row>
        </Card>
      ) : (
        <View style={{ flexDirection: 'row' }}>
          <Button label="Delete set list" kind="danger" onPress={() => setConfirmDelete(true)} />
        </View>
      )}
    </Screen>
  );
}
