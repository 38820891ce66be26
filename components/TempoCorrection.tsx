// The player's word on a recording's tempo: take a related candidate, halve or double, or tap it in.
import React, { useRef, useState } from 'react';
import { Pressable, Text, View } from 'react-native';
import { Button, Small } from './ui';
import { colors, layout, radius, space, type } from './theme';
import { formatBpm, tenth } from '@/shared/format';
import { tapTempo } from '@/audio/practice/tap-tempo';
import type { Analysis } from '@/shared/schemas';

const relationNames: Record<string, string> = {
  half: 'half',
  double: 'double',
  triple: 'triple',
  third: 'a third',
  quadruple: '×4',
  quarter: '÷4',
  'three-halves': 'dotted ×3/2',
  'two-thirds': 'dotted ×2/3',
  unrelated: 'other',
};

export function TempoCorrection({
  analysis,
  current,
  onChoose,
}: {
  analysis: Analysis;
  current: number;
  onChoose: (bpm: number | null) => void;
}) {
  const taps = useRef<number[]>([]);
  const [tapped, setTapped] = useState<number | null>(null);
  const detected = analysis.bpm;
  const within = (b: number) => Math.max(30, Math.min(300, tenth(b)));

  const tap = () => {
    const now = performance.now() / 1000;
    // A pause of over two seconds starts a new count.
    if (taps.current.length && now - taps.current[taps.current.length - 1]! > 2) taps.current = [];
    taps.current.push(now);
    setTapped(tapTempo(taps.current)?.bpm ?? null);
  };

  return (
    <View style={{ gap: space.md }}>
      <Small>Not the beat you feel? Pick one of these, or tap along.</Small>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
        {analysis.candidates
          .slice(1)
          // Only the relations a player could mean: a third or a quarter of the beat is a bar, not a tempo.
          .filter((c) => ['half', 'double', 'three-halves', 'two-thirds'].includes(c.relation) && c.bpm >= 40 && c.bpm <= 240)
          .map((c) => (
          <Chip key={c.bpm} label={`${formatBpm(c.bpm)} · ${relationNames[c.relation] ?? c.relation}`} onPress={() => onChoose(c.bpm)} />
        ))}
        <Chip label={`½ → ${formatBpm(within(current / 2))}`} onPress={() => onChoose(within(current / 2))} />
        <Chip label={`×2 → ${formatBpm(within(current * 2))}`} onPress={() => onChoose(within(current * 2))} />
      </View>
      <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center', flexWrap: 'wrap' }}>
        <Pressable role="button" accessibilityLabel="Tap the beat" onPress={tap} testID="tap"
          style={{ minHeight: 56, minWidth: 120, alignItems: 'center', justifyContent: 'center', borderRadius: radius.md, backgroundColor: colors.amberSoft, borderWidth: 1.5, borderColor: colors.amber }}>
          <Text style={[type.label, { color: colors.ink }]}>Tap the beat</Text>
        </Pressable>
        {tapped ? <Button label={`Use ${formatBpm(tapped)} BPM`} kind="secondary" onPress={() => onChoose(tapped)} /> : <Small>Four taps or more.</Small>}
      </View>
      {detected !== null && Math.abs(current - detected) > 0.05 ? (
        <Button label={`Back to the detected ${formatBpm(tenth(detected))} BPM`} kind="quiet" onPress={() => onChoose(null)} />
      ) : null}
    </View>
  );
}

function Chip({ label, onPress }: { label: string; onPress: () => void }) {
  return (
    <Pressable role="button" accessibilityLabel={label} onPress={onPress}
      style={{ minHeight: layout.minTouch - 4, justifyContent: 'center', paddingHorizontal: space.md, borderRadius: 999, borderWidth: 1.5, borderColor: colors.line, backgroundColor: colors.card }}>
      <Text style={[type.label, { color: colors.ink }]}>{label}</Text>
    </Pressable>
  );
}
