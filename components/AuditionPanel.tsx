// Hear the recording at another tempo (pitch kept) with a click on its beats: tempo in BPM first, the share
// of the original beside it; ±1, the next mechanical metronome mark up or down, or an exact number.
import React, { useEffect, useRef, useState } from 'react';
import { Platform, Pressable, Text, View } from 'react-native';
import { Button, Card, Field, Heading, Notice, Small } from './ui';
import { colors, layout, radius, space, type } from './theme';
import { formatBpm } from './TempoLabel';
import { nextMarkDown, nextMarkUp } from '../audio/metronome';
import { AuditionPlayer } from '../client/player';

const clampBpm = (bpm: number, original: number) => Math.round(Math.max(original * 0.4, Math.min(original * 2, bpm)) * 10) / 10;

export function AuditionPanel({ audioUrl, beats, downbeats, originalBpm }: { audioUrl: string; beats: number[]; downbeats: number[]; originalBpm: number }) {
  const player = useRef<AuditionPlayer | null>(null);
  const [ready, setReady] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  const [playing, setPlaying] = useState(false);
  const [bpm, setBpm] = useState(Math.round(originalBpm * 10) / 10);
  const [typed, setTyped] = useState('');
  const [clickOn, setClickOn] = useState(true);
  const [position, setPosition] = useState(0);

  // The grid is read when the player is made; a changed correction does not reload the audio.
  const grid = useRef({ beats, downbeats, originalBpm });
  grid.current = { beats, downbeats, originalBpm };

  // Web Audio exists only in the browser, and only after the first render (static rendering has no window).
  useEffect(() => {
    if (Platform.OS !== 'web') return;
    const p = new AuditionPlayer(audioUrl, grid.current);
    player.current = p;
    p.load().then(() => setReady(true), (e: Error) => setFailure(e.message));
    // The player stops by itself at the end: keep the button in step with it.
    const tick = setInterval(() => {
      setPosition(p.position());
      setPlaying(p.playing);
    }, 100);
    return () => {
      clearInterval(tick);
      p.dispose();
    };
  }, [audioUrl]);

  const apply = (next: number) => {
    const v = clampBpm(next, originalBpm);
    setBpm(v);
    player.current?.setBpm(v);
  };
  const pct = Math.round((bpm / originalBpm) * 100);

  return (
    <Card testID="audition">
      <Heading level={3}>Listen at another tempo</Heading>
      {failure ? <Notice tone="error">{failure}</Notice> : null}
      <View style={{ flexDirection: 'row', alignItems: 'baseline', gap: space.md, flexWrap: 'wrap' }}>
        <Text style={[type.tempo, { color: colors.ink }]} testID="playback-bpm">
          {formatBpm(bpm)}
          <Text style={[type.h3, { color: colors.muted }]}> BPM</Text>
        </Text>
        <Text style={[type.label, { color: colors.muted }]} testID="playback-percent">
          {pct} % of {formatBpm(Math.round(originalBpm * 10) / 10)}
        </Text>
      </View>
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Step label="◂ mark" onPress={() => apply(nextMarkDown(bpm))} />
        <Step label="−1" onPress={() => apply(bpm - 1)} />
        <Step label="+1" onPress={() => apply(bpm + 1)} />
        <Step label="mark ▸" onPress={() => apply(nextMarkUp(bpm))} />
        <Step label="75 %" onPress={() => apply(originalBpm * 0.75)} />
        <Step label="100 %" onPress={() => apply(originalBpm)} />
      </View>
      <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'flex-end' }}>
        <View style={{ flex: 1 }}>
          <Field label="Exact tempo (BPM)" value={typed} onChangeText={setTyped} inputMode="decimal" testID="exact-bpm"
            onSubmitEditing={() => typed && apply(Number(typed.replace(',', '.')))} />
        </View>
        <Button label="Set" kind="secondary" onPress={() => typed && apply(Number(typed.replace(',', '.')))} testID="set-bpm" />
      </View>
      <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center', flexWrap: 'wrap' }}>
        <Button label={playing ? 'Pause' : 'Play'} disabled={!ready} testID="play"
          onPress={() => {
            const p = player.current;
            if (!p) return;
            if (playing) p.pause();
            else void p.play();
            setPlaying(!playing);
          }} />
        <Button label={clickOn ? 'Click on' : 'Click off'} kind="secondary"
          onPress={() => {
            if (player.current) player.current.clickOn = !clickOn;
            setClickOn(!clickOn);
          }} />
        <Small>
          <Text testID="playback-position">{position.toFixed(1)}</Text> s
        </Small>
      </View>
      <Notice tone="caution">
        Keep the volume moderate: long practice at high headphone levels harms hearing (WHO–ITU H.870 safe listening). The
        click starts quiet; turn the music down before you turn the click up.
      </Notice>
    </Card>
  );
}

function Step({ label, onPress }: { label: string; onPress: () => void }) {
  return (
    <Pressable role="button" accessibilityLabel={label} onPress={onPress}
      style={{ minHeight: layout.minTouch, minWidth: 56, alignItems: 'center', justifyContent: 'center', paddingHorizontal: space.md, borderRadius: radius.sm, borderWidth: 1.5, borderColor: colors.line, backgroundColor: colors.card }}>
      <Text style={[type.label, { color: colors.ink }]}>{label}</Text>
    </Pressable>
  );
}
