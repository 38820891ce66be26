// The audition player on the recording screen, laid out: the waveform (overview and zoomable detail) with the
// beat grid as the player feels it, the transport, the tempo control, the beat you feel, candidate tempos, saved
// passages and the loop with step-up practice, the levels of click and music, and export as WAV. On a phone a
// compact transport stays on screen above the navigation; on a wide screen the waveform and transport stay in view
// while the side column scrolls. What each part does lives in hooks beside its parts in audition/.
import React, { useEffect, useMemo, useState } from 'react';
import { Text, useWindowDimensions, View } from 'react-native';
import { Button, Card, Heading, Notice, Row, Small } from './ui';
import { colors, layout, space, type } from './theme';
import { PlayerWaveform } from '@/components/audition/PlayerWaveform';
import { PositionReadout } from '@/components/audition/PositionReadout';
import { TempoControl } from '@/components/audition/TempoControl';
import { CandidateTempos } from '@/components/audition/CandidateTempos';
import { PassageLoop, type SnapUnit } from '@/components/audition/PassageLoop';
import { SavedPassages } from '@/components/audition/SavedPassages';
import { BeatFeel } from '@/components/audition/BeatFeel';
import { Transport } from '@/components/audition/Transport';
import { SoundLevels } from '@/components/audition/SoundLevels';
import { useAuditionPlayer } from '@/components/audition/useAuditionPlayer';
import { useStepUpRun } from '@/components/audition/useStepUpRun';
import { usePlayerKeys } from '@/components/audition/usePlayerKeys';
import { useWavExport } from '@/components/audition/useWavExport';
import { PracticeLog } from './PracticeLog';
import { useCandidates, usePassages } from '@/client/hooks';
import { keepLastLoop, readLastLoop } from '@/client/last-loop';
import { barContaining, describePassage, snapPassage, type Passage as Region } from '@/audio/practice/passage';
import { feltGrid } from '@/audio/practice/beat-grid';
import { beatsPerBar } from '@/audio/playback/click';
import { formatBpm } from '@/shared/format';
import type { Passage, PeaksDto, Recording, Song } from '@/shared/schemas';

/** A short listen of a beat level: two bars at 70 BPM in 4/4 (about 7 s), long enough to feel where the beat
 * falls, short enough to compare two at once (from memory; no standard sets it). */
const LISTEN_SEC = 7;
/** Loop edges within a millisecond of a saved passage's are that passage. */
const SAME_EDGE_SEC = 1e-3;
const samePlace = (a: Region, p: Passage) =>
  Math.abs(a.start - p.startSec) < SAME_EDGE_SEC && Math.abs(a.end - p.endSec) < SAME_EDGE_SEC;
/** Sticky is a web-only position value React Native's types do not list. */
const sticky = (edge: 'top' | 'bottom') => ({ position: 'sticky', [edge]: 0, zIndex: 2 }) as object;

export function AuditionPanel({
  recording,
  song,
  peaks,
  canEdit,
  audioUrl,
}: {
  recording: Recording;
  song: Song | undefined;
  peaks: PeaksDto | undefined;
  canEdit: boolean;
  audioUrl: string;
}) {
  const a = recording.analysis!;
  const wide = useWindowDimensions().width >= layout.wideFrom;
  const meter = a.meter ?? song?.meter ?? null;
  const { beatLevel, barOneSec, nudgeMs } = recording;
  const felt = useMemo(
    () =>
      feltGrid(
        { beats: a.beats, downbeats: a.downbeats, bpm: recording.originalBpm! },
        { beatLevel, barOneSec, nudgeMs },
        beatsPerBar(meter),
      ),
    [a.beats, a.downbeats, recording.originalBpm, beatLevel, barOneSec, nudgeMs, meter],
  );
  const originalBpm = felt.bpm;
  const grid = {
    beats: felt.beats,
    downbeats: felt.downbeats,
    durationSec: recording.durationSec || a.durationSec,
    originalBpm,
    meter,
  };
  const audition = useAuditionPlayer(audioUrl, grid);
  const { ready, failure, bpm, setBpm, loop, getPosition, skip } = audition;

  // The last loop comes back after a reload; every new loop is kept as the last one.
  useEffect(() => {
    const last = readLastLoop(recording.id);
    if (last) audition.setLoop(last);
    // Once, when the player for this recording is made.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [recording.id]);
  useEffect(() => {
    if (loop) keepLastLoop(recording.id, loop);
  }, [loop, recording.id]);

  const { passages: all } = usePassages(song?.id);
  const passages = useMemo(() => (all ?? []).filter((p) => p.recordingId === recording.id), [all, recording.id]);
  const saved = loop ? (passages.find((p) => samePlace(loop, p)) ?? null) : null;
  const stepUp = useStepUpRun({
    audition,
    song,
    recordingId: recording.id,
    saved,
    canLog: canEdit,
    downbeats: felt.downbeats,
    originalBpm,
  });
  const { candidates } = useCandidates(song?.id);
  usePlayerKeys({ togglePlay: audition.togglePlay, skip, bpm, setBpm, candidateBpms: candidates?.map((c) => c.bpm) });
  const { exporting, exportWav } = useWavExport({
    audition,
    downbeats: felt.downbeats,
    name: recording.label || song?.title || recording.originalName || 'recording',
  });
  const [unit, setUnit] = useState<SnapUnit>('bar');
  const loopLabel = loop ? (saved?.name ?? describePassage(loop, felt.downbeats)) : null;
  const marked = useMemo(
    () => passages.map((p) => ({ id: p.id, name: p.name, start: p.startSec, end: p.endSec })),
    [passages],
  );

  const player = (
    <Card testID="audition" style={wide ? (sticky('top') as object) : undefined}>
      <Heading level={3}>Listen at another tempo</Heading>
      {failure ? <Notice tone="error">{failure}</Notice> : null}
      {peaks ? (
        <PlayerWaveform
          minMax={peaks.minMax}
          durationSec={peaks.durationSec}
          beats={felt.beats}
          downbeats={felt.downbeats}
          getPosition={getPosition}
          loop={loop}
          passages={marked}
          onSeek={audition.seek}
          onSelect={(from, to) => {
            const p = snapPassage(grid, from, to, unit);
            if (p) stepUp.changePassage(p);
          }}
        />
      ) : null}
      <Small>
        Amber lines start bars, thin lines are beats (shown when zoomed in enough to read). Tap to move, drag to mark a
        passage, pinch, scroll or use − + to zoom.
      </Small>
      <PositionReadout
        getPosition={getPosition}
        beats={felt.beats}
        downbeats={felt.downbeats}
        durationSec={grid.durationSec}
      />
      <Transport audition={audition} />
      {!ready && !failure ? <Small>Loading the audio…</Small> : null}
      {wide ? (
        <Small>
          Keys: space plays and pauses, ← → skip a bar, ↑ ↓ change the tempo by 1 BPM, 1–9 pick a candidate.
        </Small>
      ) : null}
      <TempoControl bpm={bpm} originalBpm={originalBpm} song={song} onChange={setBpm} />
    </Card>
  );

  const beatFeel = (
    <Card>
      <Heading level={3}>The beat you feel</Heading>
      <BeatFeel
        recording={recording}
        analysis={a}
        beats={felt.beats}
        getPosition={getPosition}
        canEdit={canEdit}
        onListen={(level) =>
          audition.listen(
            feltGrid(
              { beats: a.beats, downbeats: a.downbeats, bpm: recording.originalBpm! },
              { beatLevel: level, barOneSec, nudgeMs },
              beatsPerBar(meter),
            ),
            LISTEN_SEC,
          )
        }
      />
    </Card>
  );

  const passagesCard = (
    <Card>
      <Heading level={3}>Passages</Heading>
      {song ? (
        <SavedPassages
          songId={song.id}
          recordingId={recording.id}
          passages={passages}
          active={saved}
          loop={loop}
          loopLabel={loopLabel}
          downbeats={felt.downbeats}
          goalBpm={song.goalBpm ?? null}
          canEdit={canEdit}
          onLoop={(p) => stepUp.changePassage({ start: p.startSec, end: p.endSec })}
        />
      ) : null}
      <PassageLoop
        key={saved?.id ?? (loop ? `${loop.start}-${loop.end}` : 'none')}
        loop={loop}
        loopLabel={loopLabel}
        unit={unit}
        stepUp={stepUp.stepUp}
        defaultPlan={stepUp.defaultPlan}
        canLog={canEdit}
        lastLogged={stepUp.logged}
        onUnit={setUnit}
        onThisBar={() => {
          const bar = barContaining(getPosition(), grid);
          if (bar) stepUp.changePassage(bar);
        }}
        onClear={() => {
          keepLastLoop(recording.id, null);
          stepUp.changePassage(null);
        }}
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
  );

  const candidatesCard = song ? (
    <Card>
      <Heading level={3}>Candidate tempos</Heading>
      <CandidateTempos song={song} bpm={bpm} canEdit={canEdit} wide={wide} onHop={setBpm} />
    </Card>
  ) : null;

  const rest = (
    <>
      <Card>
        <Heading level={3}>Click and levels</Heading>
        <SoundLevels
          clickOn={audition.clickOn}
          clickLevel={audition.clickLevel}
          musicLevel={audition.musicLevel}
          onClickOn={audition.setClickOn}
          onClickLevel={audition.setClickLevel}
          onMusicLevel={audition.setMusicLevel}
        />
      </Card>
      <Card>
        <Heading level={3}>Take it with you</Heading>
        <Small>Render at {formatBpm(bpm)} BPM, pitch kept, as a WAV file.</Small>
        <Row>
          <Button
            label={exporting === 'the recording' ? 'Rendering…' : 'Download the recording'}
            kind="secondary"
            disabled={!ready || exporting !== null}
            onPress={() => void exportWav(null)}
            testID="export-recording"
          />
          {loop ? (
            <Button
              label={exporting && exporting !== 'the recording' ? 'Rendering…' : `Download ${loopLabel}`}
              kind="secondary"
              disabled={!ready || exporting !== null}
              onPress={() => void exportWav(loop)}
              testID="export-loop"
            />
          ) : null}
        </Row>
      </Card>
    </>
  );

  if (wide) {
    // The player column keeps the waveform and transport at the top of the view; the side column scrolls past.
    return (
      <View style={{ flexDirection: 'row', gap: space.lg }}>
        <View style={{ flex: 3, gap: space.lg }}>
          {player}
          {beatFeel}
        </View>
        <View style={{ flex: 2, gap: space.lg }}>
          {passagesCard}
          {candidatesCard}
          {rest}
        </View>
      </View>
    );
  }
  return (
    <View style={{ gap: space.lg }}>
      {player}
      {passagesCard}
      {candidatesCard}
      {beatFeel}
      {rest}
      <View
        testID="compact-transport"
        style={[
          sticky('bottom'),
          {
            backgroundColor: colors.card,
            borderTopWidth: 1,
            borderColor: colors.line,
            paddingVertical: space.sm,
            paddingHorizontal: space.xs,
            marginHorizontal: -space.xs,
            borderRadius: 12,
            shadowColor: colors.ink,
            shadowOpacity: 0.12,
            shadowRadius: 8,
          },
        ]}
      >
        <Transport audition={audition} compact />
      </View>
    </View>
  );
}
