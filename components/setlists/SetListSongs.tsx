// A set list's songs in playing order: each one's click tempo (or the analysed one, marked as not chosen) and
// length, moved up or down or taken out.
import React from 'react';
import { Text, useWindowDimensions, View } from 'react-native';
import { Card, Chip, Small } from '@/components/ui';
import { colors, fonts, layout, space, type } from '@/components/theme';
import type { SetListDto } from '@/shared/schemas';
import { songLength, songTempo } from './lengths';

/** The order with the song at `from` moved to `to`. */
export function moved(ids: string[], from: number, to: number): string[] {
  const next = [...ids];
  const [id] = next.splice(from, 1);
  next.splice(to, 0, id!);
  return next;
}

export function SetListSongs({
  list,
  busy,
  onOrder,
}: {
  list: SetListDto;
  busy: boolean;
  onOrder: (songIds: string[]) => void;
}) {
  const ids = list.songs.map((s) => s.songId);
  // On a wide screen the buttons sit beside the tempo; on a phone they get a line of their own.
  const wide = useWindowDimensions().width >= layout.wideFrom;
  return (
    <View style={{ gap: space.sm }} testID="set-list-songs">
      {list.songs.map((song, i) => (
        <Card
          key={song.songId}
          testID="set-list-song"
          style={{
            paddingVertical: space.md,
            flexDirection: wide ? 'row' : 'column',
            alignItems: wide ? 'center' : undefined,
          }}
        >
          <View style={{ flex: wide ? 1 : undefined, flexDirection: 'row', alignItems: 'center', gap: space.md }}>
            <Text style={[type.h3, { color: colors.muted, width: 28 }]}>{i + 1}</Text>
            <View style={{ flex: 1, gap: 2 }}>
              <Text style={[type.body, { fontFamily: fonts.bodyBold, color: colors.ink }]}>{song.title}</Text>
              <Small>
                {song.meter} · <Text testID="set-list-song-length">{songLength(song)}</Text>
              </Small>
            </View>
            <SongTempoFigure song={song} />
          </View>
          <View style={{ flexDirection: 'row', gap: space.sm, justifyContent: 'flex-end' }}>
            <Chip
              label="↑"
              compact
              hint={`Move ${song.title} up`}
              disabled={busy || i === 0}
              onPress={() => onOrder(moved(ids, i, i - 1))}
            />
            <Chip
              label="↓"
              compact
              hint={`Move ${song.title} down`}
              disabled={busy || i === ids.length - 1}
              onPress={() => onOrder(moved(ids, i, i + 1))}
            />
            <Chip
              label="Take out"
              hint={`Take ${song.title} out of the set list`}
              disabled={busy}
              onPress={() => onOrder(ids.filter((id) => id !== song.songId))}
            />
          </View>
        </Card>
      ))}
    </View>
  );
}

/** The chosen tempo large in amber; an analysed one smaller and muted, over "BPM, not chosen"; or the words alone. */
function SongTempoFigure({ song }: { song: SetListDto['songs'][number] }) {
  const t = songTempo(song);
  const words = <Text style={[type.small, { color: colors.muted }]}>{t.chosen ? ` ${t.words}` : t.words}</Text>;
  return (
    <View
      style={{ alignItems: 'flex-end', maxWidth: 150 }}
      accessible
      accessibilityLabel={t.spoken}
      testID="set-list-song-tempo"
    >
      {t.chosen ? (
        <Text style={{ fontFamily: fonts.displayBold, fontSize: 26, color: colors.amber }}>
          {t.figure}
          {words}
        </Text>
      ) : (
        <>
          {t.figure ? (
            <Text style={{ fontFamily: fonts.displayBold, fontSize: 20, lineHeight: 24, color: colors.muted }}>
              {t.figure}
            </Text>
          ) : null}
          {words}
        </>
      )}
    </View>
  );
}
