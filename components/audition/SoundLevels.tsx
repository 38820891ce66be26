// Levels of the click and the music, each on its own, with the hearing caution beside them.
import React from 'react';
import { Text, View } from 'react-native';
import { Chip, Notice, Row } from '@/components/ui';
import { colors, space, type } from '@/components/theme';

const STEP = 0.05;
const pct = (v: number) => `${Math.round(v * 100)} %`;

export function Level({
  label,
  value,
  onChange,
  testID,
}: {
  label: string;
  value: number;
  onChange: (v: number) => void;
  testID: string;
}) {
  const set = (v: number) => onChange(Math.round(Math.max(0, Math.min(1, v)) * 100) / 100);
  return (
    <Row>
      <Text style={[type.label, { color: colors.ink, minWidth: 56 }]}>{label}</Text>
      <Chip label="−" hint={`${label} quieter`} onPress={() => set(value - STEP)} />
      <Text style={[type.label, { color: colors.muted, minWidth: 48, textAlign: 'center' }]} testID={testID}>
        {pct(value)}
      </Text>
      <Chip label="+" hint={`${label} louder`} onPress={() => set(value + STEP)} />
    </Row>
  );
}

export function SoundLevels({
  clickOn,
  clickLevel,
  musicLevel,
  onClickOn,
  onClickLevel,
  onMusicLevel,
}: {
  clickOn: boolean;
  clickLevel: number;
  musicLevel: number;
  onClickOn: (on: boolean) => void;
  onClickLevel: (v: number) => void;
  onMusicLevel: (v: number) => void;
}) {
  return (
    <View style={{ gap: space.sm }}>
      <Row>
        <Chip
          label={clickOn ? 'Click on' : 'Click off'}
          selected={clickOn}
          onPress={() => onClickOn(!clickOn)}
          testID="click-toggle"
        />
        <Chip
          label={musicLevel === 0 ? 'Music muted: click only' : 'Mute the music'}
          hint="Mute the music and keep the click"
          selected={musicLevel === 0}
          onPress={() => onMusicLevel(musicLevel === 0 ? 1 : 0)}
        />
      </Row>
      <Level label="Click" value={clickLevel} onChange={onClickLevel} testID="click-level" />
      <Level label="Music" value={musicLevel} onChange={onMusicLevel} testID="music-level" />
      <Notice tone="caution">
        Mind your ears: long practice at high headphone levels harms hearing (WHO–ITU H.870, safe listening). The click
        starts at a quarter of full level; keep it and the music moderate, and take listening breaks.
      </Notice>
    </View>
  );
}
