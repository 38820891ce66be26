// Where playback is: bar (or the pickup's beats, or before the music's first beat), beat in the bar, and the time
// against the recording's length. Bar and beat are large enough to read from a music stand, in fixed-width boxes
// with tabular figures so nothing beside them moves as the numbers change.
import React from 'react';
import { Text, View } from 'react-native';
import { colors, fonts, space, type } from '@/components/theme';
import { usePolled } from '@/components/audition/PlayerWaveform';
import { barAt, beatInBar } from '@/audio/practice/passage';
import { formatClock } from '@/shared/format';

/** How often the readout looks at the player: 20 times a second, faster than the tenths it shows are read. */
const POLL_MS = 50;

/** Digits of one width (the font's tabular figures), so a changing number never shifts its neighbours. */
const tabular = { fontVariant: ['tabular-nums' as const] };
/** The bar number: the one figure read at a glance from the instrument. */
const BAR_TYPE = { fontFamily: fonts.displayBold, fontSize: 44, lineHeight: 48, minHeight: 48, ...tabular };
/** On the bar number's line, so the readout keeps its height before bar 1 too, when both are empty. */
const BEAT_TYPE = { fontFamily: fonts.display, fontSize: 28, lineHeight: 48, minHeight: 48, ...tabular };
/** Wide enough for a three-digit bar (tabular figures are about 0.6 em each) and for the labels above. */
const BAR_BOX = 92;
/** In the box while there is no bar or beat to show (before bar 1, or the pickup's bar). */
const NONE = '–';
const BEAT_BOX = 48;

export function PositionReadout({
  getPosition,
  beats,
  downbeats,
  durationSec,
}: {
  getPosition: () => number;
  beats: number[];
  downbeats: number[];
  durationSec: number;
}) {
  const t = usePolled(getPosition, POLL_MS);
  const bar = barAt(t, downbeats);
  const beat = beatInBar(t, beats, downbeats);
  const barLabel = bar === 0 ? (beats.length > 0 && t >= beats[0]! - 0.02 ? 'Pickup' : 'Before bar 1') : 'Bar';
  return (
    <View
      testID="position-readout"
      style={{ flexDirection: 'row', alignItems: 'flex-end', flexWrap: 'wrap', columnGap: space.lg }}
    >
      <View style={{ minWidth: BAR_BOX }}>
        <Text style={[type.small, { color: colors.muted }]}>{barLabel}</Text>
        <Text testID="playback-bar" style={[BAR_TYPE, { color: bar === 0 ? colors.muted : colors.ink }]}>
          {bar === 0 ? NONE : bar}
        </Text>
      </View>
      <View style={{ minWidth: BEAT_BOX }}>
        <Text style={[type.small, { color: colors.muted }]}>Beat</Text>
        <Text testID="playback-beat" style={[BEAT_TYPE, { color: beat > 0 ? colors.ink : colors.muted }]}>
          {beat > 0 ? beat : NONE}
        </Text>
      </View>
      <Text style={[type.label, tabular, { color: colors.muted, paddingBottom: space.xs }]}>
        <Text testID="playback-position" accessibilityLabel={`${t.toFixed(1)} seconds`}>
          {formatClock(t)}
        </Text>{' '}
        / {formatClock(durationSec)}
      </Text>
    </View>
  );
}
