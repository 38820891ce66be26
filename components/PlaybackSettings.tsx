// How the player stretches a recording to another tempo: the phase vocoder (the default) or overlap-add. The
// figures behind the two descriptions are in the README ("Playback and stretch").
import React from 'react';
import { View } from 'react-native';
import { Card, Chip, Heading, Small } from './ui';
import { space } from './theme';
import { setPreferences, usePreferences } from '@/client/hooks';
import type { StretchMethod } from '@/shared/schemas';

const METHODS: { method: StretchMethod; label: string; says: string }[] = [
  {
    method: 'phase-vocoder',
    label: 'Steady timing',
    says: 'Every note on time and low notes in tune at any speed; drum hits sound a little softer.',
  },
  {
    method: 'overlap-add',
    label: 'Crisp hits',
    says: 'Sharper drum hits and less work for the processor; when slowed right down, notes land slightly early and some hits can drop out at double speed.',
  },
];

export function PlaybackSettings() {
  const { preferences } = usePreferences();
  if (!preferences) return null;
  const chosen = METHODS.find((m) => m.method === preferences.stretchMethod) ?? METHODS[0]!;
  return (
    <Card testID="playback-settings">
      <Heading level={2}>Slowed-down sound</Heading>
      <Small>How the player changes a recording&apos;s tempo without changing its pitch.</Small>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, marginTop: space.sm }}>
        {METHODS.map((m) => (
          <Chip
            key={m.method}
            label={m.label}
            selected={m.method === chosen.method}
            onPress={() => setPreferences({ stretchMethod: m.method })}
            hint={m.says}
            testID={`stretch-${m.method}`}
          />
        ))}
      </View>
      <View testID="stretch-says">
        <Small>{chosen.says}</Small>
      </View>
    </Card>
  );
}
