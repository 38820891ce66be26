// The audition player on the recording screen, laid out: the waveform with the beat grid and a playhead to seek
// on, the transport (skip by a bar, count-in), the tempo control, candidate tempos and the chosen one, a passage
// loop with step-up practice, the levels of click and music, and export as WAV. What each part does lives in
// hooks beside its parts in audition/: the player's life (useAuditionPlayer), the step-up run (useStepUpRun),
// the keys (usePlayerKeys) and the export (useWavExport).
import React, { useState } from 'react';
import { Text, useWindowDimensions, View } from 'react-native';
import { Button, Card, Chip, Heading, Notice, Row, Small } from './ui';
import { colors, layout, space, type } from './theme';
import { PlayerWaveform } from '@/components/audition/PlayerWaveform';
import { PositionReadout } from '@/components/audition/PositionReadout';
import { TempoControl } from '@/components/audition/TempoControl';
import { CandidateTempos } from '@/components/audition/CandidateTempos';
import { PassageLoop, type SnapUnit } from '@/components/audition/PassageLoop';
import { SoundLevels } from '@/components/audition/SoundLevels';
import { useAuditionPlayer } from '@/components/audition/useAuditionPlayer';
import { useStepUpRun } from '@/components/audition/useStepUpRun';
import { usePlayerKeys } from '@/components/audition/usePlayerKeys';
import { useWavExport } from '@/components/audition/useWavExport';
import { PracticeLog } from './PracticeLog';
import { useCandidates } from '@/client/hooks';
import { barContaining, describePassage, snapPassage } from '@/audio/practice/passage';
import { formatBpm } from '@/shared/format';
import type { PeaksDto, Recording, Song } from '@/shared/schemas';

export function AuditionPanel({ recording, song, peaks, canEdit, audioUrl }: { recording: Recording; song: Song | undefined; peaks: PeaksDto | undefined; canEdit: boolean; audioUrl: string }) {
  const a = recording.analysis!;
  const originalBpm = recording.originalBpm!;
  const wide = useWindowDimensions().width >= layout.wideFrom;
  const grid = { beats: a.beats, downbeats: a.downbeats, durationSec: recording.durationSec || a.durationSec, originalBpm, meter: a.meter ?? song?.meter ?? null };
  const audition = useAuditionPlayer(audioUrl, grid);
  const { ready, failure, playing, bpm, setBpm, loop, getPosition, skip } = audition;
  const stepUp = useStepUpRun({ audition, song, canLog: canEdit, downbeats: a.downbeats, originalBpm });
  const { candidates } = useCandidates(song?.id);
  usePlayerKeys({ togglePlay: audition.togglePlay, skip, bpm, setBpm, candidateBpms: candidates?.map((c) => c.bpm) });
  const { exporting, exportWav } = useWavExport({ audition, downbeats: a.downbeats, name: recording.label || song?.title || recording.originalName || 'recording' });
  const [selecting, setSelecting] = useState(false);
  const [unit, setUnit] = useState<SnapUnit>('bar');
  const loopLabel = loop ? describePassage(loop, a.downbeats) : null;
  const column = wide ? { flex: 1, gap: space.lg } : { gap: space.lg };

  return (
    <>
      <Card testID="audition">
        <Heading level={3}>Listen at another tempo</Heading>
        {failure ? <Notice tone="error">{failure}</Notice> : null}
        {peaks ? (
          <PlayerWaveform minMax={peaks.minMax} durationSec={peaks.durationSec} beats={a.beats} downbeats={a.downbeats} getPosition={getPosition}
            loop={loop} selecting={selecting} onSeek={audition.seek}
            onSelect={(from, to) => {
              setSelecting(false);
              const p = snapPassage(grid, from, to, unit);
              if (p) stepUp.changePassage(p);
            }} />
        ) : null}
        <Small>Thin lines are beats, amber lines bar starts. Tap or drag on the waveform to move; mark a passage to loop it.</Small>
        <PositionReadout getPosition={getPosition} beats={a.beats} downbeats={a.downbeats} durationSec={grid.durationSec} />
        <Row>
          <Chip label="‹ Bar" hint="Back a bar" onPress={() => skip(-1)} testID="bar-back" />
          <Button label={playing ? 'Pause' : 'Play'} disabled={!ready} onPress={audition.togglePlay} testID="play" />
          <Chip label="Bar ›" hint="Forward a bar" onPress={() => skip(1)} testID="bar-forward" />
          <Chip label="Count-in" hint="Count in one bar before playing" selected={audition.countInOn} onPress={() => audition.setCountIn(!audition.countInOn)} testID="count-in" />
        </Row>
        {!ready && !failure ? <Small>Loading the audio…</Small> : null}
        {wide ? <Small>Keys: space plays and pauses, ← → skip a bar, ↑ ↓ change the tempo by 1 BPM, 1–9 pick a candidate.</Small> : null}
        <TempoControl bpm={bpm} originalBpm={originalBpm} song={song} onChange={setBpm} />
      </Card>

      <View style={wide ? { flexDirection: 'row', gap: space.lg, alignItems: 'flex-start' } : { gap: space.lg }}>
        <View style={column}>
          {song ? (
            <Card>
              <Heading level={3}>Candidate tempos</Heading>
              <CandidateTempos song={song} bpm={bpm} canEdit={canEdit} wide={wide} onHop={setBpm} />
            </Card>
          ) : null}

          <Card>
            <Heading level={3}>Loop a passage</Heading>
            <PassageLoop
              loop={loop}
              loopLabel={loopLabel}
              selecting={selecting}
              unit={unit}
              stepUp={stepUp.stepUp}
              defaultPlan={stepUp.defaultPlan}
              canLog={canEdit}
              lastLogged={stepUp.logged}
              onSelecting={setSelecting}
              onUnit={setUnit}
              onThisBar={() => {
                const bar = barContaining(getPosition(), grid);
                if (bar) stepUp.changePassage(bar);
              }}
              onClear={() => stepUp.changePassage(null)}
              onStartStepUp={stepUp.start}
              onNotClean={stepUp.notClean}
              onEndStepUp={stepUp.end}
            />
            {song ? (
              <View style={{ gap: space.xs }}>
                <Text style={[type.label, { color: colors.muted }]}>Practice log</Text>
                <PracticeLog songId={song.id} />
              </View>
            ) : null}
          </Card>
        </View>

        <View style={column}>
          <Card>
            <Heading level={3}>Click and levels</Heading>
            <SoundLevels clickOn={audition.clickOn} clickLevel={audition.clickLevel} musicLevel={audition.musicLevel}
              onClickOn={audition.setClickOn} onClickLevel={audition.setClickLevel} onMusicLevel={audition.setMusicLevel} />
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
