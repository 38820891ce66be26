// Where playback is: bar (or the pickup's beats, or before the music's first beat), beat in the bar, and the time
// against the recording's length.
import React from 'react';
import { Text } from 'react-native';
import { colors, type } from '@/components/theme';
import { usePolled } from '@/components/audition/PlayerWaveform';
import { barAt, beatInBar } from '@/audio/practice/passage';
import { formatClock } from '@/shared/format';

/** How often the readout looks at the player: 20 times a second, faster than the tenths it shows are read. */
const POLL_MS = 50;

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
  return (
    <Text style={[type.label, { color: colors.ink }]}>
      {bar === 0 ? (beats.length > 0 && t >= beats[0]! - 0.02 ? 'Pickup' : 'Before bar 1') : 'Bar '}
      <Text testID="playback-bar">{bar === 0 ? '' : bar}</Text>
      {beat > 0 ? <Text style={{ color: colors.muted }}>{` · beat ${beat}`}</Text> : null}
      <Text style={{ color: colors.muted }}>
        {'  ·  '}
        <Text testID="playback-position" accessibilityLabel={`${t.toFixed(1)} seconds`}>
          {formatClock(t)}
        </Text>{' '}
        / {formatClock(durationSec)}
      </Text>
    </Text>
  );
}
