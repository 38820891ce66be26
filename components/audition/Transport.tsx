// The transport: play/pause, a bar back or forward, the count-in and, while it runs, the count shown beat by
// beat. `compact` is the phone's bar that stays on screen (with tempo −/+ and the BPM) while the page scrolls.
import React from 'react';
import { Text, View } from 'react-native';
import { Button, Chip, Row } from '@/components/ui';
import { colors, fonts, space, type } from '@/components/theme';
import { formatBpm, tenth } from '@/shared/format';
import { usePolled } from './PlayerWaveform';
import type { AuditionPlayerState } from './useAuditionPlayer';

/** Read 30 times a second: a count-in beat at 240 BPM lasts 250 ms, so each is seen several times. */
const COUNT_POLL_MS = 33;

export function Transport({ audition, compact = false }: { audition: AuditionPlayerState; compact?: boolean }) {
  const { ready, playing, togglePlay, skip, bpm, setBpm } = audition;
  const suffix = compact ? '-compact' : '';
  // The button itself says the audio is still loading, so nothing below it moves when it is ready.
  const label = !ready ? (audition.failure ? 'Play' : 'Loading…') : playing ? 'Pause' : 'Play';
  const play = <Button label={label} disabled={!ready} onPress={togglePlay} testID={`play${suffix}`} />;
  if (compact) {
    return (
      <View style={{ flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.xs }}>
        <Chip label="‹" hint="Back a bar" onPress={() => skip(-1)} testID="bar-back-compact" compact />
        {play}
        <Chip label="›" hint="Forward a bar" onPress={() => skip(1)} testID="bar-forward-compact" compact />
        <CountIn audition={audition} />
        <Chip label="−" hint="Tempo down 1 BPM" onPress={() => setBpm(bpm - 1)} testID="tempo-down-compact" compact />
        <Text
          style={[type.label, { color: colors.ink, minWidth: 64, textAlign: 'center' }]}
          testID="playback-bpm-compact"
        >
          {formatBpm(tenth(bpm))} BPM
        </Text>
        <Chip label="+" hint="Tempo up 1 BPM" onPress={() => setBpm(bpm + 1)} testID="tempo-up-compact" compact />
      </View>
    );
  }
  return (
    <Row>
      <Chip label="‹ Bar" hint="Back a bar" onPress={() => skip(-1)} testID="bar-back" />
      {play}
      <Chip label="Bar ›" hint="Forward a bar" onPress={() => skip(1)} testID="bar-forward" />
      <Chip
        label="Count-in"
        hint="Count in one bar before playing"
        selected={audition.countInOn}
        onPress={() => audition.setCountIn(!audition.countInOn)}
        testID="count-in"
      />
      <CountIn audition={audition} />
    </Row>
  );
}

/** The count-in's beat number, large, while it counts (nothing otherwise). */
function CountIn({ audition }: { audition: AuditionPlayerState }) {
  const beat = usePolled(audition.getCountInBeat, COUNT_POLL_MS);
  if (beat === null) return null;
  return (
    <Text
      testID="count-in-beat"
      accessibilityLiveRegion="polite"
      style={{
        fontFamily: fonts.displayBold,
        fontSize: 28,
        lineHeight: 32,
        color: beat === 1 ? colors.amber : colors.teal,
        minWidth: 28,
        textAlign: 'center',
      }}
    >
      {beat}
    </Text>
  );
}
