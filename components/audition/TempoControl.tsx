// The playback tempo in BPM first (what a musician thinks in), with the share of the original beside it: ±1,
// the next mechanical metronome mark, 75 % / 100 %, an exact number, or one of the song's saved tempos.
import React, { useState } from 'react';
import { Text, View } from 'react-native';
import { Button, Chip, Field, Row, Small } from '@/components/ui';
import { colors, space, type } from '@/components/theme';
import { formatBpm, tenth } from '@/shared/format';
import { nextMarkDown, nextMarkUp } from '@/audio/practice/metronome';
import type { Song } from '@/shared/schemas';

export function TempoControl({
  bpm,
  originalBpm,
  song,
  onChange,
}: {
  bpm: number;
  originalBpm: number;
  song: Song | undefined;
  onChange: (bpm: number) => void;
}) {
  const [typed, setTyped] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const low = tenth(originalBpm * 0.4);
  const high = tenth(originalBpm * 2);
  const submit = () => {
    const v = Number(typed.replace(',', '.'));
    if (!typed.trim() || !Number.isFinite(v)) return setProblem('Type a tempo in BPM, such as 96 or 96.5.');
    if (v < low || v > high)
      return setProblem(
        `This recording plays from ${formatBpm(low)} to ${formatBpm(high)} BPM (40–200 % of its tempo).`,
      );
    setProblem(null);
    onChange(v);
  };
  const saved = [
    { label: 'Goal', value: song?.goalBpm },
    { label: 'Working', value: song?.workingBpm },
    { label: 'Chosen', value: song?.chosenBpm },
  ].filter(
    (s): s is { label: string; value: number } => typeof s.value === 'number' && s.value >= low && s.value <= high,
  );

  return (
    <View style={{ gap: space.sm }}>
      <Row align="baseline" gap={space.md}>
        <Text style={[type.tempo, { color: colors.ink }]} testID="playback-bpm">
          {formatBpm(tenth(bpm))}
          <Text style={[type.h3, { color: colors.muted }]}> BPM</Text>
        </Text>
        <Text style={[type.label, { color: colors.muted }]} testID="playback-percent">
          {Math.round((bpm / originalBpm) * 100)} % of {formatBpm(tenth(originalBpm))}
        </Text>
      </Row>
      <Row>
        <Chip label="◂ mark" hint="Previous metronome mark" onPress={() => onChange(nextMarkDown(bpm))} />
        <Chip label="−1" onPress={() => onChange(bpm - 1)} />
        <Chip label="+1" onPress={() => onChange(bpm + 1)} />
        <Chip label="mark ▸" hint="Next metronome mark" onPress={() => onChange(nextMarkUp(bpm))} />
        <Chip label="75 %" onPress={() => onChange(originalBpm * 0.75)} />
        <Chip label="100 %" onPress={() => onChange(originalBpm)} />
      </Row>
      {saved.length > 0 ? (
        <Row>
          <Small>Saved:</Small>
          {saved.map((s) => (
            <Chip
              key={s.label}
              label={`${s.label} ${formatBpm(s.value)}`}
              selected={Math.abs(s.value - bpm) < 0.05}
              onPress={() => onChange(s.value)}
              testID={`saved-${s.label.toLowerCase()}`}
            />
          ))}
        </Row>
      ) : null}
      <Row align="flex-end">
        <View style={{ flex: 1, minWidth: 160, maxWidth: 280 }}>
          <Field
            label="Exact tempo (BPM)"
            value={typed}
            onChangeText={setTyped}
            inputMode="decimal"
            testID="exact-bpm"
            error={problem}
            onSubmitEditing={submit}
          />
        </View>
        <Button label="Set" kind="secondary" onPress={submit} testID="set-bpm" />
      </Row>
    </View>
  );
}
