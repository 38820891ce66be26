// A recording: its analysis as it runs, then the tempo with its confidence and related tempos, the beat grid
// over the waveform with the audition player and the beat the player feels (the correction lives in the player).
import React from 'react';
import { useLocalSearchParams, useRouter } from 'expo-router';
import { Text, View } from 'react-native';
import { Body, Button, Card, Heading, Loading, Notice, Screen, Small } from '@/components/ui';
import { Waveform } from '@/components/Waveform';
import { ProgressBar } from '@/components/ProgressBar';
import { AuditionPanel } from '@/components/AuditionPanel';
import { TempoCurveChart } from '@/components/charts/TempoCurveChart';
import { apiBase } from '@/client/api';
import { formatBpm, formatDuration, plural, tenth, whose } from '@/shared/format';
import { colors, space, type } from '@/components/theme';
import { LEVEL_FACTOR } from '@/audio/practice/beat-grid';
import { retryAnalysis, useMe, usePeaks, useRecording, useSong } from '@/client/hooks';
import { NotesPanel } from '@/components/NotesPanel';
import { ScreenTitle } from '@/components/ScreenTitle';

export default function RecordingScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const router = useRouter();
  const { recording: r, error } = useRecording(id);
  const peaks = usePeaks(id, r?.status === 'done');
  const { song } = useSong(r?.songId);
  const { me } = useMe();
  if (error)
    return (
      <Screen>
        <Notice tone="error">This recording could not be opened: {error.message}</Notice>
      </Screen>
    );
  if (!r) return <Loading />;
  const a = r.analysis;
  // The tempo at the level the player feels (half or double of the one found or corrected).
  const bpm = r.originalBpm === null ? null : r.originalBpm * LEVEL_FACTOR[r.beatLevel];

  return (
    <Screen testID="recording" wide>
      <ScreenTitle title={[r.label || r.originalName || 'Recording', song?.title].filter(Boolean).join(' · ')} />
      <Button label="‹ Song" kind="quiet" onPress={() => router.navigate(`/songs/${r.songId}`)} />
      <View style={{ gap: space.xs }}>
        <Heading>{r.label || r.originalName || 'Recording'}</Heading>
        <Small>
          {whose(r.kind === 'take' ? 'take' : 'reference', { id: r.ownerId, name: r.ownerName }, me?.id)}
          {r.uploadedBy ? ` (added by ${r.uploadedBy.name})` : ''} · {r.format.toUpperCase()} ·{' '}
          {formatDuration(r.durationSec)}
        </Small>
      </View>

      {r.status === 'queued' || r.status === 'running' ? (
        <Card testID="analysis-status">
          <Body>{r.status === 'queued' ? 'Waiting for a free analyser…' : 'Listening for the beat…'}</Body>
          <ProgressBar value={r.progress} label="Analysis progress" />
        </Card>
      ) : null}

      {r.status === 'failed' ? (
        <Card>
          <Notice tone="error">{r.error ?? 'The analysis failed.'}</Notice>
          {r.permissions.edit ? <Button label="Try the analysis again" onPress={() => retryAnalysis(r.id)} /> : null}
        </Card>
      ) : null}

      {r.status === 'done' && a ? (
        <>
          <Card testID="tempo-result">
            <Small>
              {r.correctedBpm !== null || r.beatLevel !== 'as-found' ? 'Tempo (the beat you feel)' : 'Detected tempo'}
            </Small>
            <Text style={[type.tempo, { color: colors.amber }]} testID="detected-bpm">
              {bpm === null ? 'No steady beat' : formatBpm(tenth(bpm))}
              {bpm === null ? null : <Text style={[type.h3, { color: colors.muted }]}> BPM</Text>}
            </Text>
            <Small>
              Confidence {Math.round(a.confidence * 100)} % · {a.meter ?? 'meter unclear'} ·{' '}
              {plural(a.beatCount, 'beat')}
            </Small>
            {a.confidence < 0.4 ? (
              <Notice tone="caution">Tactus is not sure about this one: check it by tapping along.</Notice>
            ) : null}
          </Card>
          {bpm !== null ? (
            // A corrected grid (tempo, level, bar 1, nudge) reaches the same player: the audio is not decoded again.
            <AuditionPanel
              key={r.id}
              recording={r}
              song={song}
              peaks={peaks}
              canEdit={r.permissions.edit}
              audioUrl={`${apiBase}/api/recordings/${r.id}/audio`}
            />
          ) : peaks ? (
            <Card>
              <Waveform
                minMax={peaks.minMax}
                durationSec={peaks.durationSec}
                beats={a.beats}
                downbeats={a.downbeats}
                testID="waveform"
              />
            </Card>
          ) : null}
          {/* With a player, the tempo curve is drawn on the beat the player feels, with the steadiness report. */}
          {bpm === null ? (
            <Card testID="tempo-curve-card">
              <Heading level={3}>Tempo across the recording</Heading>
              <TempoCurveChart analysis={a} song={song} />
            </Card>
          ) : null}
          {/* With a player, the notes sit beside it (AuditionPanel), where tapping one plays from it. */}
          {bpm === null ? <NotesPanel recording={r} /> : null}
        </>
      ) : null}
    </Screen>
  );
}
