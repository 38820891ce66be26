import React from 'react';
import { Text, View } from 'react-native';
import { colors, fonts, type } from './theme';

/** A tempo as a musician reads it: the number big, "BPM" small, a caption above. */
export function TempoLabel({ caption, bpm, accent }: { caption: string; bpm: number | null; accent?: boolean }) {
  return (
    <View style={{ minWidth: 76 }}>
      <Text style={[type.small, { color: colors.muted }]}>{caption}</Text>
      <Text style={{ fontFamily: fonts.displayBold, fontSize: 22, color: bpm === null ? colors.line : accent ? colors.amber : colors.ink }}>
        {bpm === null ? '—' : formatBpm(bpm)}
        {bpm === null ? null : <Text style={[type.small, { color: colors.muted }]}> BPM</Text>}
      </Text>
    </View>
  );
}

/** Whole tempos without decimals, others to one decimal place. */
export const formatBpm = (bpm: number) => (Number.isInteger(bpm) ? String(bpm) : bpm.toFixed(1));
