// The stage view of a set list: every song's click tempo large, black on white, on screen or printed. No
// navigation around it, so it fits a music stand or a phone on the floor.
import React from 'react';
import { Platform, ScrollView, StyleSheet, Text, View } from 'react-native';
import { useLocalSearchParams, useRouter } from 'expo-router';
import { Button, Loading } from '@/components/ui';
import { ScreenTitle } from '@/components/ScreenTitle';
import { fonts, space } from '@/components/theme';
import { useSetList } from '@/client/hooks';
import { ApiRequestError } from '@/client/api';
import { songLength, songTempo, totalLength } from '@/components/setlists/lengths';
import type { SetListDto } from '@/shared/schemas';
import { printPage, usePrintStyles } from '@/components/setlists/printStyles';

const INK = '#000000';
const PAPER = '#ffffff';

export default function StageView() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const router = useRouter();
  const { setList, error, isLoading } = useSetList(id);
  usePrintStyles();

  if (error) {
    const signedOut = error instanceof ApiRequestError && error.status === 401;
    return (
      <View style={styles.page}>
        <Text style={styles.meta}>
          {signedOut ? 'Sign in to see this set list.' : `This set list could not be found: ${error.message}`}
        </Text>
        <Button
          label={signedOut ? 'Sign in' : 'Set lists'}
          onPress={() => router.navigate(signedOut ? '/sign-in' : '/set-lists')}
        />
      </View>
    );
  }
  if (isLoading || !setList) return <Loading />;

  return (
    <ScrollView style={{ backgroundColor: PAPER }} contentContainerStyle={styles.page} testID="stage-view">
      <ScreenTitle title={`${setList.name} (stage)`} />
      <View nativeID="stage-toolbar" style={styles.toolbar}>
        <Button label="‹ Back" kind="quiet" onPress={() => router.navigate(`/set-lists/${setList.id}`)} />
        {Platform.OS === 'web' ? <Button label="Print" kind="secondary" onPress={printPage} testID="print" /> : null}
      </View>
      <Text style={styles.name} role="heading" aria-level={1}>
        {setList.name}
      </Text>
      <Text style={styles.meta} testID="stage-total">
        {totalLength(setList)}
      </Text>
      {setList.songs.map((song, i) => (
        <View key={song.songId} style={styles.song} testID="stage-song">
          <Text style={styles.number}>{i + 1}</Text>
          <View style={{ flex: 1 }}>
            <Text style={styles.title}>{song.title}</Text>
            <Text style={styles.meta}>
              {song.meter} · {songLength(song)}
            </Text>
          </View>
          <StageTempo song={song} />
        </View>
      ))}
      <Text style={styles.meta}>
        Click tempos in BPM (beats per minute), each song&apos;s chosen tempo; ≈ marks a tempo analysed from a recording
        where none is chosen yet.
      </Text>
    </ScrollView>
  );
}

/** The chosen tempo as large as the stand needs; an analysed one smaller, with "≈" and "not chosen" in words, so
 * it is not taken for a decision; none, in words. Ink only: it must print. */
function StageTempo({ song }: { song: SetListDto['songs'][number] }) {
  const t = songTempo(song);
  return (
    <View
      style={{ alignItems: 'flex-end', maxWidth: 180 }}
      accessible
      accessibilityLabel={t.spoken}
      testID="stage-tempo"
    >
      {t.figure ? (
        <Text style={t.chosen ? styles.bpm : styles.guideBpm} testID="stage-bpm">
          {t.figure}
        </Text>
      ) : null}
      <Text style={t.chosen ? styles.unit : styles.unitWords}>{t.words}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  page: { backgroundColor: PAPER, padding: space.lg, gap: space.md, maxWidth: 900, width: '100%', alignSelf: 'center' },
  toolbar: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center' },
  name: { fontFamily: fonts.displayBold, fontSize: 28, lineHeight: 34, color: INK },
  meta: { fontFamily: fonts.body, fontSize: 16, lineHeight: 22, color: INK },
  song: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingVertical: space.sm,
    borderBottomWidth: 2,
    borderBottomColor: INK,
  },
  number: { fontFamily: fonts.displayBold, fontSize: 24, color: INK, width: 32 },
  title: { fontFamily: fonts.bodyBold, fontSize: 22, lineHeight: 28, color: INK },
  unit: { fontFamily: fonts.bodyBold, fontSize: 14, color: INK, letterSpacing: 1 },
  bpm: { fontFamily: fonts.displayBold, fontSize: 64, lineHeight: 70, color: INK, minWidth: 120, textAlign: 'right' },
  guideBpm: { fontFamily: fonts.displayBold, fontSize: 36, lineHeight: 42, color: INK, textAlign: 'right' },
  unitWords: { fontFamily: fonts.bodyBold, fontSize: 14, color: INK, letterSpacing: 1, textAlign: 'right' },
});
