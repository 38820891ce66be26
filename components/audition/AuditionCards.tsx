// The cards of the audition player, each drawing one part of an AuditionSession: the player (waveform,
// position, transport, tempo), the beat you feel, passages with the loop and step-up, candidate tempos, levels,
// export, and the phone's compact transport.
import { RaiseOffer } from '@/components/RaiseOffer';
import React from 'react';
import { Text, View } from 'react-native';
import { Button, Card, Heading, Notice, Row, Small } from '@/components/ui';
import { colors, space, type } from '@/components/theme';
import { PracticeLog } from '@/components/PracticeLog';
import { NotesPanel } from '@/components/NotesPanel';
import { SteadinessReport } from '@/components/SteadinessReport';
import { barContaining, snapPassage } from '@/audio/practice/passage';
import { formatBpm } from '@/shared/format';
import type { PeaksDto, Recording, Song } from '@/shared/schemas';
import type { AuditionSession } from './useAuditionSession';
import { PlayerWaveform } from './PlayerWaveform';
import { PositionReadout } from './PositionReadout';
import { TempoControl } from './TempoControl';
import { CandidateTempos } from './CandidateTempos';
import { PassageLoop } from './PassageLoop';
import { SavedPassages } from './SavedPassages';
import { BeatFeel } from './BeatFeel';
import { Transport } from './Transport';
import { SoundLevels } from './SoundLevels';

/** Sticky is a web-only position value React Native's types do not list. */
export const sticky = (edge: 'top' | 'bottom') => ({ position: 'sticky', [edge]: 0, zIndex: 2 }) as object;

export function PlayerCard({
  s,
  peaks,
  song,
  wide,
}: {
  s: AuditionSession;
  peaks: PeaksDto | undefined;
  song: Song | undefined;
  wide: boolean;
}) {
  const { audition, felt, grid, stepUp } = s;
  return (
    <Card testID="audition" style={wide ? (sticky('top') as object) : undefined}>
      <Heading level={3}>Listen at another tempo</Heading>
      {audition.failure ? <Notice tone="error">{audition.failure}</Notice> : null}
      {s.breakReminder.due ? <BreakSuggestion onDismiss={s.breakReminder.dismiss} /> : null}
      {peaks ? (
        <PlayerWaveform
          minMax={peaks.minMax}
          durationSec={peaks.durationSec}
          beats={felt.beats}
          downbeats={felt.downbeats}
          getPosition={audition.getPosition}
          loop={audition.loop}
          passages={s.marked}
          notes={s.noteMarks}
          onSeek={audition.seek}
          onSelect={(from, to) => {
            const p = snapPassage(grid, from, to, s.unit);
            if (p) stepUp.changePassage(p);
          }}
        />
      ) : null}
      <Small>
        Amber lines start bars, thin lines are beats (shown when zoomed in enough to read). Tap to move, drag to mark a
        passage, pinch, scroll or use − + to zoom.
      </Small>
      <PositionReadout
        getPosition={audition.getPosition}
        beats={felt.beats}
        downbeats={felt.downbeats}
        durationSec={grid.durationSec}
      />
      <Transport audition={audition} />
      {wide ? (
        <Small>
          Keys: space plays and pauses, ← → skip a bar, ↑ ↓ change the tempo by 1 BPM, 1–9 pick a candidate.
        </Small>
      ) : null}
      <TempoControl bpm={audition.bpm} originalBpm={felt.bpm} song={song} onChange={audition.setBpm} />
    </Card>
  );
}

export function BeatFeelCard({
  s,
  recording,
  canEdit,
}: {
  s: AuditionSession;
  recording: Recording;
  canEdit: boolean;
}) {
  return (
    <Card>
      <Heading level={3}>The beat you feel</Heading>
      <BeatFeel
        recording={recording}
        analysis={s.a}
        beats={s.felt.beats}
        getPosition={s.audition.getPosition}
        canEdit={canEdit}
        onListen={s.listen}
      />
    </Card>
  );
}

export function PassagesCard({
  s,
  song,
  recording,
  canEdit,
}: {
  s: AuditionSession;
  song: Song | undefined;
  recording: Recording;
  canEdit: boolean;
}) {
  const { audition, stepUp } = s;
  return (
    <Card>
      <Heading level={3}>Passages</Heading>
      {song ? (
        <SavedPassages
          songId={song.id}
          recordingId={recording.id}
          passages={s.passages}
          active={s.saved}
          loop={audition.loop}
          loopLabel={s.loopLabel}
          downbeats={s.felt.downbeats}
          goalBpm={song.goalBpm ?? null}
          canEdit={canEdit}
          canSetTempos={song.permissions.setTempos}
          onLoop={(p) => stepUp.changePassage({ start: p.startSec, end: p.endSec })}
        />
      ) : null}
      <PassageLoop
        key={s.saved?.id ?? (audition.loop ? `${audition.loop.start}-${audition.loop.end}` : 'none')}
        loop={audition.loop}
        loopLabel={s.loopLabel}
        unit={s.unit}
        stepUp={stepUp.stepUp}
        defaultPlan={stepUp.defaultPlan}
        canLog={canEdit}
        lastLogged={stepUp.logged}
        onUnit={s.setUnit}
        onThisBar={() => {
          const bar = barContaining(audition.getPosition(), s.grid);
          if (bar) stepUp.changePassage(bar);
        }}
        onClear={s.clearLoop}
        onStartStepUp={stepUp.start}
        onNotClean={stepUp.notClean}
        onEndStepUp={stepUp.end}
      />
      {stepUp.offer ? (
        <RaiseOffer key={`${stepUp.offer.toBpm}-${stepUp.logged}`} offer={stepUp.offer} onDone={stepUp.dismissOffer} />
      ) : null}
      {song ? (
        <View style={{ gap: space.xs }}>
          <Text style={[type.label, { color: colors.muted }]}>Practice log</Text>
          <PracticeLog songId={song.id} />
        </View>
      ) : null}
    </Card>
  );
}

export function CandidatesCard({
  s,
  song,
  canEdit,
  wide,
}: {
  s: AuditionSession;
  song: Song | undefined;
  canEdit: boolean;
  wide: boolean;
}) {
  if (!song) return null;
  return (
    <Card>
      <Heading level={3}>Candidate tempos</Heading>
      <CandidateTempos song={song} bpm={s.audition.bpm} canEdit={canEdit} wide={wide} onHop={s.audition.setBpm} />
    </Card>
  );
}

export function LevelsAndExport({ s }: { s: AuditionSession }) {
  const { audition, wav } = s;
  const { loop, ready } = audition;
  return (
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
        <Small>Render at {formatBpm(audition.bpm)} BPM, pitch kept, as a WAV file.</Small>
        <Row>
          <Button
            label={wav.exporting === 'the recording' ? 'Rendering…' : 'Download the recording'}
            kind="secondary"
            disabled={!ready || wav.exporting !== null}
            onPress={() => void wav.exportWav(null)}
            testID="export-recording"
          />
          {loop ? (
            <Button
              label={wav.exporting && wav.exporting !== 'the recording' ? 'Rendering…' : `Download ${s.loopLabel}`}
              kind="secondary"
              disabled={!ready || wav.exporting !== null}
              onPress={() => void wav.exportWav(loop)}
              testID="export-loop"
            />
          ) : null}
        </Row>
      </Card>
    </>
  );
}

/** On a phone: play/pause, a bar back and forward, tempo − and + with the BPM, kept above the navigation. */
export function CompactTransportBar({ s }: { s: AuditionSession }) {
  return (
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
      <Transport audition={s.audition} compact />
    </View>
  );
}

/** The recording's notes, where tapping a note plays from its moment or loops its bars. */
export function NotesCard({ s, recording }: { s: AuditionSession; recording: Recording }) {
  return (
    <NotesPanel
      recording={recording}
      onSeek={s.audition.seek}
      onLoop={(start, end) => s.stepUp.changePassage({ start, end })}
    />
  );
}

/** The tempo curve with the steadiness report, on the grid the player feels; a region's Loop plays it. */
export function SteadinessCard({
  s,
  recording,
  song,
  canEdit,
}: {
  s: AuditionSession;
  recording: Recording;
  song: Song | undefined;
  canEdit: boolean;
}) {
  return (
    <Card testID="tempo-curve-card">
      <Heading level={3}>{recording.kind === 'take' ? 'How steady' : 'Tempo across the recording'}</Heading>
      <SteadinessReport
        recording={recording}
        song={song}
        grid={s.grid}
        canEdit={canEdit}
        loop={s.audition.loop}
        loopLabel={s.loopLabel}
        onLoop={(start, end) => s.stepUp.changePassage({ start, end })}
      />
    </Card>
  );
}

/** After 45 minutes of continuous practice: a suggestion, never a block; the player goes on when they choose. */
function BreakSuggestion({ onDismiss }: { onDismiss: () => void }) {
  return (
    <View style={{ gap: space.xs }} testID="break-suggestion">
      <Notice tone="caution">
        You have been practising for 45 minutes with hardly a pause. A few minutes away from the instrument (stretch,
        rest your ears) helps hands, arms and hearing; if anything aches or rings, stop and ask a health professional.
      </Notice>
      <Button label="Not now" kind="quiet" onPress={onDismiss} testID="dismiss-break" />
    </View>
  );
}
