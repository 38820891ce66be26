// Set lists: the player's lists for gigs and recitals, each with its length at the chosen tempos; make a new one.
import React, { useState } from 'react';
import { Pressable, View } from 'react-native';
import { useRouter } from 'expo-router';
import { Body, Button, Card, EmptyState, Field, Heading, Loading, Notice, Screen, Small } from '@/components/ui';
import { ScreenTitle } from '@/components/ScreenTitle';
import { space } from '@/components/theme';
import { createSetList, useSetLists } from '@/client/hooks';
import { plural } from '@/shared/format';
import { totalLength } from '@/components/setlists/lengths';
import { SetListInputSchema } from '@/shared/schemas';
import { fieldProblems } from '@/shared/messages';

export default function SetLists() {
  const router = useRouter();
  const { setLists, error, isLoading } = useSetLists();
  const [name, setName] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const create = async () => {
    const parsed = SetListInputSchema.safeParse({ name });
    if (!parsed.success) {
      setProblem(fieldProblems(parsed.error).name ?? parsed.error.issues[0]!.message);
      return;
    }
    setBusy(true);
    setProblem(null);
    try {
      const list = await createSetList(parsed.data.name);
      setName('');
      router.navigate(`/set-lists/${list.id}`);
    } catch (e) {
      setProblem((e as Error).message);
    } finally {
      setBusy(false);
    }
  };

  return (
    <Screen testID="set-lists">
      <ScreenTitle title="Set lists" />
      <Heading>Set lists</Heading>
      <Body muted>
        Songs in playing order, each at its chosen tempo, with how long the set lasts and every click tempo on one page
        for the stage.
      </Body>
      {error ? <Notice tone="error">Your set lists could not be loaded: {error.message}</Notice> : null}
      {isLoading ? <Loading /> : null}
      <Card>
        <View style={{ gap: space.md }}>
          <Field
            label="New set list"
            placeholder="e.g. Friday at the Pier Street café"
            value={name}
            onChangeText={setName}
            onSubmitEditing={create}
            error={problem}
            testID="new-set-list-name"
          />
          <View style={{ flexDirection: 'row' }}>
            <Button label="Make the set list" onPress={create} busy={busy} testID="create-set-list" />
          </View>
        </View>
      </Card>
      {setLists && setLists.length === 0 ? (
        <EmptyState title="No set lists yet">
          Name one above for your next gig or recital, then add songs from your library in the order you will play them.
        </EmptyState>
      ) : null}
      {setLists?.map((list) => (
        <Pressable
          key={list.id}
          role="link"
          accessibilityLabel={`Open ${list.name}`}
          onPress={() => router.navigate(`/set-lists/${list.id}`)}
        >
          <Card testID="set-list-card">
            <Body style={{ fontWeight: '700' }}>{list.name}</Body>
            <Small>
              {plural(list.songs.length, 'song')} · {totalLength(list)}
            </Small>
          </Card>
        </Pressable>
      ))}
    </Screen>
  );
}
