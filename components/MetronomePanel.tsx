// Click-only mode: a plain metronome at any BPM and meter, with the same tempo steps as the player.
import React, { useEffect, useRef, useState } from 'react';
import { Platform, Text, View } from 'react-native';
import { Button, Card, Chip, Heading, Notice, Row, Small } from './ui';
import { colors, space, type } from './theme';
import { formatBpm, tenth } from '@/shared/format';
import { Level } from '@/components/audition/SoundLevels';
import { usePolled } from '@/components/audition/PlayerWaveform';
import { beatsPerBar } from '@/audio/playback/click';
import { markingsFor, nextMarkDown, nextMarkUp } from '@/audio/practice/metronome';
import { Metronome } from '@/client/metronome';
import { DEFAULT_CLICK_GAIN } from '@/client/click-sound';

const METERS = ['2/4', '3/4', '4/4', '5/4', '6/8', '7/8', '12/8'];
const MIN = 30;
const MAX = 300;

export function MetronomePanel({
  initialBpm = 100,
  initialMeter = '4/4',
}: {
  initialBpm?: number;
  initialMeter?: string;
}) {
  const clock = useRef<Metronome | null>(null);
  const [bpm, setBpm] = useState(initialBpm);
  const [meter, setMeter] = useState(initialMeter);
  const [running, setRunning] = useState(false);
  const [level, setLevel] = useState(DEFAULT_CLICK_GAIN);
  // The metronome is made once; later changes of tempo and meter go to it through set().
  const initial = useRef({ bpm: initialBpm, meter: initialMeter });
  useEffect(() => {
    if (Platform.OS !== 'web') return;
    const m = new Metronome();
    m.set(initial.current.bpm, initial.current.meter);
    clock.current = m;
    // The browser test counts the clicks from here.
    (window as unknown as { tactusMetronome?: Metronome }).tactusMetronome = m;
    return () => m.dispose();
  }, []);
  const apply = (v: number) => {
    const next = tenth(Math.max(MIN, Math.min(MAX, v)));
    setBpm(next);
    clock.current?.set(next, meter);
  };
  const markings = markingsFor(bpm)
    .map((m) => m.name)
    .join(' · ');
  return (
    <Card testID="metronome">
      <Heading level={3}>Metronome</Heading>
      <Row align="baseline">
        <Text style={[type.tempo, { color: colors.ink }]} testID="metronome-bpm">
          {formatBpm(bpm)}
          <Text style={[type.h3, { color: colors.muted }]}> BPM</Text>
        </Text>
        {markings ? <Small>{markings}</Small> : null}
      </Row>
      <BeatLights clock={clock} perBar={beatsPerBar(meter)} />
      <Row>
        <Chip label="◂ mark" hint="Previous metronome mark" onPress={() => apply(nextMarkDown(bpm))} />
        <Chip label="−1" onPress={() => apply(bpm - 1)} />
        <Chip label="+1" onPress={() => apply(bpm + 1)} />
        <Chip label="mark ▸" hint="Next metronome mark" onPress={() => apply(nextMarkUp(bpm))} />
      </Row>
      <Row>
        {METERS.map((m) => (
          <Chip
            key={m}
            label={m}
            selected={meter === m}
            onPress={() => {
              setMeter(m);
              clock.current?.set(bpm, m);
            }}
          />
        ))}
      </Row>
      <Row>
        <Button
          label={running ? 'Stop' : 'Start'}
          testID="metronome-start"
          onPress={() => {
            const m = clock.current;
            if (!m) return;
            if (running) m.stop();
            else void m.start();
            setRunning(!running);
          }}
        />
      </Row>
      {/* The level on a line of its own: beside Start, "Click" read as part of the button's words. */}
      <Level
        label="Click"
        value={level}
        onChange={(v) => {
          clock.current?.setVolume(v);
          setLevel(v);
        }}
        testID="metronome-level"
      />
      <Notice tone="caution">
        Keep the click moderate, above all in headphones: long listening at high levels harms hearing (WHO–ITU H.870,
        safe listening).
      </Notice>
    </Card>
  );
}

/** One light per beat of the bar; the sounding beat is lit, the downbeat in amber. */
function BeatLights({ clock, perBar }: { clock: React.RefObject<Metronome | null>; perBar: number }) {
  const now = usePolled(() => clock.current?.beatNow() ?? null, 30);
  return (
    <View
      style={{ flexDirection: 'row', gap: space.sm }}
      accessibilityElementsHidden
      importantForAccessibility="no-hide-descendants"
    >
      {Array.from({ length: perBar }, (_, i) => (
        <View
          key={i}
          testID={now === i ? 'beat-lit' : undefined}
          style={{
            width: 18,
            height: 18,
            borderRadius: 9,
            borderWidth: 2,
            borderColor: i === 0 ? colors.amber : colors.teal,
            backgroundColor: now === i ? (i === 0 ? colors.amber : colors.teal) : 'transparent',
          }}
        />
      ))}
    </View>
  );
}
