// The library on a wide screen: one row per song, the columns a player scans (a phone gets SongCard instead).
import React from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { useRouter } from 'expo-router';
import { colors, fonts, layout, radius, space, type } from '@/components/theme';
import { formatBpm, formatDate } from '@/shared/format';
import type { SongListItem } from '@/shared/schemas';

const COLUMNS = [
  { label: 'Title', flex: 3 },
  { label: 'Composer or artist', flex: 2.2 },
  { label: 'Key', flex: 1 },
  { label: 'Time sig.', flex: 0.9 },
  { label: 'Working / goal BPM', flex: 1.8 },
  { label: 'Chosen BPM', flex: 1.2 },
  { label: 'Last practised', flex: 1.5 },
] as const;

const none = <Text style={{ color: colors.muted }}>—</Text>;

export function SongTable({ songs }: { songs: SongListItem[] }) {
  const router = useRouter();
  return (
    <View style={styles.table} testID="song-table">
      <View style={[styles.row, styles.head]}>
        {COLUMNS.map((c) => (
          <Text key={c.label} style={[type.small, styles.headCell, { flex: c.flex }]}>
            {c.label}
          </Text>
        ))}
      </View>
      {songs.map((song) => (
        <Pressable
          key={song.id}
          role="link"
          accessibilityLabel={`Open ${song.title}`}
          onPress={() => router.navigate(`/songs/${song.id}`)}
          testID="song-row"
          style={({ pressed, hovered }: { pressed: boolean; hovered?: boolean }) => [
            styles.row,
            (pressed || hovered) && { backgroundColor: colors.tealSoft },
          ]}
        >
          <View style={[styles.cell, { flex: COLUMNS[0].flex }]}>
            <Text testID="library-song-title" style={[type.body, { fontFamily: fonts.bodyBold, color: colors.ink }]}>
              {song.title}
            </Text>
            {song.ready ? <Text style={[type.small, { color: colors.teal }]}>Ready to perform</Text> : null}
          </View>
          <Text style={[type.body, styles.cell, { flex: COLUMNS[1].flex }]}>{song.composer ?? none}</Text>
          <Text style={[type.body, styles.cell, { flex: COLUMNS[2].flex }]}>{song.key ?? none}</Text>
          <Text style={[type.body, styles.cell, { flex: COLUMNS[3].flex }]}>{song.meter}</Text>
          <View style={[styles.cell, { flex: COLUMNS[4].flex }]}>
            <Text style={[type.body, { color: colors.ink }]}>
              {song.workingBpm === null ? '—' : formatBpm(song.workingBpm)} /{' '}
              {song.goalBpm === null ? '—' : formatBpm(song.goalBpm)}
            </Text>
            {song.progress !== null ? (
              <View style={styles.bar}>
                <View
                  style={{
                    width: `${Math.min(1, song.progress) * 100}%`,
                    height: '100%',
                    backgroundColor: colors.teal,
                  }}
                />
              </View>
            ) : null}
          </View>
          <Text
            style={[type.body, styles.cell, { flex: COLUMNS[5].flex, fontFamily: fonts.bodyBold, color: colors.amber }]}
          >
            {song.chosenBpm === null ? none : formatBpm(song.chosenBpm)}
          </Text>
          <Text style={[type.body, styles.cell, { flex: COLUMNS[6].flex }]}>
            {song.lastPractisedAt ? (
              formatDate(song.lastPractisedAt)
            ) : (
              <Text style={{ color: colors.muted }}>Not yet</Text>
            )}
          </Text>
        </Pressable>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  table: {
    backgroundColor: colors.card,
    borderWidth: 1,
    borderColor: colors.line,
    borderRadius: radius.md,
    overflow: 'hidden',
  },
  head: { backgroundColor: colors.paper, minHeight: 36 },
  headCell: { color: colors.muted, fontFamily: fonts.bodyMedium, paddingHorizontal: space.sm },
  row: {
    flexDirection: 'row',
    alignItems: 'center',
    minHeight: layout.minTouch + 8,
    paddingHorizontal: space.sm,
    borderBottomWidth: 1,
    borderBottomColor: colors.line,
  },
  cell: { paddingHorizontal: space.sm, paddingVertical: space.sm, color: colors.ink },
  bar: { height: 5, marginTop: 3, backgroundColor: colors.tealSoft, borderRadius: radius.sm, overflow: 'hidden' },
});
