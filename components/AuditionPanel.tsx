// The audition player on the recording screen: the waveform with the beat grid and a playhead to seek on, the
// transport (skip by a bar, count-in), the tempo control, candidate tempos and the chosen one, a passage loop
// with step-up practice, the levels of click and music, and export as WAV. The player itself is client/player.ts;
// this component keeps the screen and the player in step.
import React, { useCallback, useEffect, useRef, useState } from 'react';
import { Platform, Text, useWindowDimensions, View } from 'react-native';
import { Button, Card, Chip, Heading, Notice, Row, Small } from './ui';
import { colors, layout, space, type } from './theme';
import { PlayerWaveform, usePolled } from '@/components/audition/PlayerWaveform';
import { TempoControl } from '@/components/audition/TempoControl';
import { CandidateTempos } from '@/components/audition/CandidateTempos';
import { PassageLoop, type SnapUnit } from '@/components/audition/PassageLoop';
import { SoundLevels } from '@/components/audition/SoundLevels';
import { PracticeLog } from './PracticeLog';
import { AuditionPlayer, MAX_SPEED, MIN_SPEED } from '@/client/player';
import { DEFAULT_CLICK_GAIN } from '@/client/click-sound';
import { logPractice, useCandidates } from '@/client/hooks';
import { barAt, barContaining, beatInBar, describePassage, skipBar, snapPassage, type Passage } from '@/audio/practice/passage';
import { passFinished, startStepUp, type StepUpPlan, type StepUpState } from '@/audio/practice/step-up';
import { exportFileName } from '@/audio/playback/export';
import { formatBpm, formatClock, plural, tenth } from '@/shared/format';
import type { PeaksDto, Recording, Song } from '@/shared/schemas';

export function AuditionPanel({ recording, song, peaks, canEdit, audioUrl }: { recording: Recording; song: Song | undefined; peaks: PeaksDto | undefined; canEdit: boolean; audioUrl: string }) {
  const a = recording.analysis!;
  const originalBpm = recording.originalBpm!;
  const { width } = useWindowDimensions();
  const wide = width >= layout.wideFrom;
  const player = useRef<AuditionPlayer | null>(null);
  const [ready, setReady] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  const [playing, setPlaying] = useState(false);
  const [bpm, setBpmState] = useState(tenth(originalBpm));
  const [countInOn, setCountIn] = useState(false);
  const [clickOn, setClickOn] = useState(true);
  const [clickLevel, setClickLevel] = useState(DEFAULT_CLICK_GAIN);
  const [musicLevel, setMusicLevel] = useState(1);
  const [loop, setLoopState] = useState<Passage | null>(null);
  const [selecting, setSelecting] = useState(false);
  const [unit, setUnit] = useState<SnapUnit>('bar');
  const [stepUp, setStepUp] = useState<StepUpState | null>(null);
  const [logged, setLogged] = useState<string | null>(null);
  const [exporting, setExporting] = useState<string | null>(null);
  const { candidates } = useCandidates(song?.id);
  const grid = { beats: a.beats, downbeats: a.downbeats, durationSec: recording.durationSec || a.durationSec };

  // Web Audio exists only in the browser, and only after the first render (static rendering has no window).
  useEffect(() => {
    if (Platform.OS !== 'web') return;
    const p = new AuditionPlayer(audioUrl, { beats: a.beats, downbeats: a.downbeats, originalBpm, meter: a.meter ?? song?.meter ?? null });
    player.current = p;
    p.load().then(() => setReady(true), (e: Error) => setFailure(e.message));
    p.onEnded = () => setPlaying(false);
    // The player benchmark (fixtures/bench-player.ts) reads the player's figures from here.
    (window as unknown as { tactusAudition?: AuditionPlayer }).tactusAudition = p;
    return () => p.dispose();
    // The grid is read when the player is made; a correction reloads it with the new tempo.
  }, [audioUrl, originalBpm]);

  const run = useRef<{ state: StepUpState; notClean: boolean; startedAt: number } | null>(null);
  const getPosition = useCallback(() => player.current?.position() ?? 0, []);

  const apply = useCallback((next: number) => {
    const v = tenth(Math.max(originalBpm * MIN_SPEED, Math.min(originalBpm * MAX_SPEED, next)));
    setBpmState(v);
    player.current?.setBpm(v);
  }, [originalBpm]);

  const togglePlay = useCallback(() => {
    const p = player.current;
    if (!p || !ready) return;
    const wasPlaying = p.playing;
    if (wasPlaying) p.pause();
    else void p.play();
    setPlaying(!wasPlaying);
  }, [ready]);

  const seek = useCallback((sec: number) => {
    player.current?.seek(sec);
    if (player.current && !player.current.loopRegion) setLoopState(null);
  }, []);
  const skip = useCallback((dir: 1 | -1) => seek(skipBar(getPosition(), grid, dir)), [seek, getPosition, grid.downbeats]);

  // A new passage (or none) ends a step-up run on the old one; what was played is logged.
  const setLoop = (p: Passage | null) => {
    if (run.current) void finishRun(run.current.state);
    setStepUp(null);
    setLoopState(p);
    player.current?.setLoop(p);
  };

  // ── step-up: the player reports each pass through the loop ──────────────────────────────────────────
  const finishRun = async (s: StepUpState) => {
    const r = run.current;
    run.current = null;
    if (!r || s.repetitions === 0 || !song) return;
    const minutes = tenth((Date.now() - r.startedAt) / 60000);
    const passage = loop ? describePassage(loop, a.downbeats) : null;
    const reached = s.reachedBpm ?? s.plan.startBpm;
    if (!canEdit) return;
    try {
      await logPractice(song.id, { passage, startBpm: s.plan.startBpm, reachedBpm: reached, repetitions: s.repetitions, minutes, clean: s.done });
      setLogged(`Logged: ${passage ?? 'the recording'}, ${formatBpm(s.plan.startBpm)} → ${formatBpm(reached)} BPM, ${plural(s.repetitions, 'repetition')}, ${minutes} min.`);
    } catch (e) {
      setLogged(null);
      setFailure(`The practice entry was not saved: ${(e as Error).message}`);
    }
  };
  useEffect(() => {
    const p = player.current;
    if (!p) return;
    p.onLoopPass = () => {
      const r = run.current;
      if (!r) return;
      const next = passFinished(r.state, !r.notClean);
      r.state = next;
      r.notClean = false;
      setStepUp(next);
      if (next.done) {
        p.pause();
        setPlaying(false);
        void finishRun(next);
      } else if (next.bpm !== bpm) apply(next.bpm);
    };
  });
  const startRun = (plan: StepUpPlan) => {
    const s = startStepUp(plan);
    run.current = { state: s, notClean: false, startedAt: Date.now() };
    setStepUp(s);
    setLogged(null);
    apply(s.bpm);
    if (loop) player.current?.seek(loop.start);
    if (!player.current?.playing) {
      void player.current?.play();
      setPlaying(true);
    }
  };
  const endRun = () => {
    const s = run.current?.state;
    player.current?.pause();
    setPlaying(false);
    if (s) void finishRun(s);
    setStepUp(null);
  };

  // ── keyboard on wide screens: space, arrows, number keys ────────────────────────────────────────────
  const keys = useRef<(e: KeyboardEvent) => void>(() => undefined);
  keys.current = (e: KeyboardEvent) => {
    const target = e.target as HTMLElement | null;
    if (target && (target.tagName === 'INPUT' || target.tagName === 'TEXTAREA' || target.isContentEditable)) return;
    if (e.key === ' ') togglePlay();
    else if (e.key === 'ArrowLeft') skip(-1);
    else if (e.key === 'ArrowRight') skip(1);
    else if (e.key === 'ArrowUp') apply(bpm + 1);
    else if (e.key === 'ArrowDown') apply(bpm - 1);
    else if (/^[1-9]$/.test(e.key) && candidates?.[Number(e.key) - 1]) apply(candidates[Number(e.key) - 1]!.bpm);
    else return;
    // Space plays and pauses wherever the focus is (outside text fields), so it must not also press the
    // focused button: taken in the capture phase and stopped here.
    e.preventDefault();
    e.stopPropagation();
  };
  useEffect(() => {
    if (Platform.OS !== 'web') return;
    const listener = (e: KeyboardEvent) => keys.current(e);
    window.addEventListener('keydown', listener, true);
    return () => window.removeEventListener('keydown', listener, true);
  }, []);

  const exportWav = async (passage: Passage | null) => {
    const p = player.current;
    if (!p) return;
    const label = passage ? describePassage(passage, a.downbeats) : null;
    setExporting(label ?? 'the recording');
    // Let the button show it is busy before the (blocking) render starts.
    await new Promise((r) => setTimeout(r, 30));
    try {
      const wav = await p.renderWav(bpm, passage);
      const url = URL.createObjectURL(new Blob([wav as BlobPart], { type: 'audio/wav' }));
      const link = document.createElement('a');
      link.href = url;
      link.download = exportFileName(recording.label || song?.title || recording.originalName || 'recording', bpm, label);
      document.body.appendChild(link);
      link.click();
      link.remove();
      setTimeout(() => URL.revokeObjectURL(url), 60_000);
    } catch (e) {
      setFailure(`The export failed: ${(e as Error).message}`);
    } finally {
      setExporting(null);
    }
  };

  const loopLabel = loop ? describePassage(loop, a.downbeats) : null;
  const defaultPlan: StepUpPlan = {
    startBpm: tenth(Math.max(originalBpm * MIN_SPEED, (song?.workingBpm ?? originalBpm * 0.7))),
    stepBpm: 4,
    repsPerStep: 3,
    goalBpm: tenth(Math.min(originalBpm * MAX_SPEED, song?.goalBpm ?? originalBpm)),
  };

  return (
    <>
      <Card testID="audition">
        <Heading level={3}>Listen at another tempo</Heading>
        {failure ? <Notice tone="error">{failure}</Notice> : null}
        {peaks ? (
          <PlayerWaveform minMax={peaks.minMax} durationSec={peaks.durationSec} beats={a.beats} downbeats={a.downbeats} getPosition={getPosition}
            loop={loop} selecting={selecting} onSeek={seek}
            onSelect={(from, to) => {
              setSelecting(false);
              const p = snapPassage(grid, from, to, unit);
              if (p) setLoop(p);
            }} />
        ) : null}
        <Small>Thin lines are beats, amber lines bar starts. Tap or drag on the waveform to move; mark a passage to loop it.</Small>
        <PositionReadout getPosition={getPosition} beats={a.beats} downbeats={a.downbeats} durationSec={grid.durationSec} />
        <Row>
          <Chip label="‹ Bar" hint="Back a bar" onPress={() => skip(-1)} testID="bar-back" />
          <Button label={playing ? 'Pause' : 'Play'} disabled={!ready} onPress={togglePlay} testID="play" />
          <Chip label="Bar ›" hint="Forward a bar" onPress={() => skip(1)} testID="bar-forward" />
          <Chip label="Count-in" hint="Count in one bar before playing" selected={countInOn}
            onPress={() => {
              if (player.current) player.current.countInOn = !countInOn;
              setCountIn(!countInOn);
            }} testID="count-in" />
        </Row>
        {!ready && !failure ? <Small>Loading the audio…</Small> : null}
        {wide ? <Small>Keys: space plays and pauses, ← → skip a bar, ↑ ↓ change the tempo by 1 BPM, 1–9 pick a candidate.</Small> : null}
        <TempoControl bpm={bpm} originalBpm={originalBpm} song={song} onChange={apply} />
      </Card>

      <View style={wide ? { flexDirection: 'row', gap: space.lg, alignItems: 'flex-start' } : { gap: space.lg }}>
      <View style={wide ? { flex: 1, gap: space.lg } : { gap: space.lg }}>
      {song ? (
        <Card>
          <Heading level={3}>Candidate tempos</Heading>
          <CandidateTempos song={song} bpm={bpm} canEdit={canEdit} wide={wide} onHop={apply} />
        </Card>
      ) : null}

      <Card>
        <Heading level={3}>Loop a passage</Heading>
        <PassageLoop
          loop={loop}
          loopLabel={loopLabel}
          selecting={selecting}
          unit={unit}
          stepUp={stepUp}
          defaultPlan={defaultPlan}
          canLog={canEdit}
          lastLogged={logged}
          onSelecting={setSelecting}
          onUnit={setUnit}
          onThisBar={() => {
            const bar = barContaining(getPosition(), grid);
            if (bar) setLoop(bar);
          }}
          onClear={() => setLoop(null)}
          onStartStepUp={startRun}
          onNotClean={() => run.current && (run.current.notClean = true)}
          onEndStepUp={endRun}
        />
        {song ? (
          <View style={{ gap: space.xs }}>
            <Text style={[type.label, { color: colors.muted }]}>Practice log</Text>
            <PracticeLog songId={song.id} />
          </View>
        ) : null}
      </Card>

      </View>
      <View style={wide ? { flex: 1, gap: space.lg } : { gap: space.lg }}>
      <Card>
        <Heading level={3}>Click and levels</Heading>
        <SoundLevels clickOn={clickOn} clickLevel={clickLevel} musicLevel={musicLevel}
          onClickOn={(on) => {
            if (player.current) player.current.clickOn = on;
            setClickOn(on);
          }}
          onClickLevel={(v) => {
            player.current?.setClickVolume(v);
            setClickLevel(v);
          }}
          onMusicLevel={(v) => {
            player.current?.setMusicVolume(v);
            setMusicLevel(v);
          }} />
      </Card>

      <Card>
        <Heading level={3}>Take it with you</Heading>
        <Small>Render at {formatBpm(bpm)} BPM, pitch kept, as a WAV file.</Small>
        <Row>
          <Button label={exporting === 'the recording' ? 'Rendering…' : 'Download the recording'} kind="secondary" disabled={!ready || exporting !== null} onPress={() => void exportWav(null)} testID="export-recording" />
          {loop ? <Button label={exporting && exporting !== 'the recording' ? 'Rendering…' : `Download ${loopLabel}`} kind="secondary" disabled={!ready || exporting !== null} onPress={() => void exportWav(loop)} testID="export-loop" /> : null}
        </Row>
      </Card>
      </View>
      </View>
    </>
  );
}

function PositionReadout({ getPosition, beats, downbeats, durationSec }: { getPosition: () => number; beats: number[]; downbeats: number[]; durationSec: number }) {
  const t = usePolled(getPosition, 50);
  const bar = barAt(t, downbeats);
  const beat = beatInBar(t, beats, downbeats);
  return (
    <Text style={[type.label, { color: colors.ink }]}>
      {bar === 0 ? 'Pickup' : 'Bar '}
      <Text testID="playback-bar">{bar === 0 ? '' : bar}</Text>
      {beat > 0 ? <Text style={{ color: colors.muted }}>{` · beat ${beat}`}</Text> : null}
      <Text style={{ color: colors.muted }}>
        {'  ·  '}
        <Text testID="playback-position" accessibilityLabel={`${t.toFixed(1)} seconds`}>{formatClock(t)}</Text> / {formatClock(durationSec)}
      </Text>
    </Text>
  );
}
