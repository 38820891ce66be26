import React from 'react';
import { Text, View } from 'react-native';
import { colors, fonts, type } from './theme';
import { formatBpm } from '@/shared/format';

/** A tempo as a musician reads it: the number big, "BPM" small, a caption above. */
export function TempoLabel({ caption, bpm, accent }: { caption: string; bpm: number | null; accent?: boolean }) {
  return (
    <View style={{ minWidth: 76 }}>
      <Text style={[type.small, { color: colors.muted }]}>{caption}</Text>
      <Text
        style={{
          fontFamily: fonts.displayBold,
          fontSize: 22,
          color: bpm === null ? colors.line : accent ? colors.amber : colors.ink,
        }}
      >
        {bpm === null ? '—' : formatBpm(bpm)}
        {bpm === null ? null : <Text style={[type.small, { color: colors.muted }]}> BPM</Text>}
      </Text>
    </View>
  );
}

/** A song's three tempos side by side. */
export function SongTempos({
  working,
  goal,
  chosen,
}: {
  working: number | null;
  goal: number | null;
  chosen: number | null;
}) {
  return (
    <View style={{ flexDirection: 'row', gap: 16, flexWrap: 'wrap' }}>
      <TempoLabel caption="Working" bpm={working} />
      <TempoLabel caption="Goal" bpm={goal} />
      <TempoLabel caption="Chosen" bpm={chosen} accent />
    </View>
  );
}
