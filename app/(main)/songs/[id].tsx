// A song: its tempos, its recordings (references and takes) and adding a new one.
import React from 'react';
import { useLocalSearchParams, useRouter } from 'expo-router';
import { View } from 'react-native';
import { Body, Button, EmptyState, Heading, Loading, Notice, Screen, Small } from '@/components/ui';
import { SongTempos } from '@/components/TempoLabel';
import { UploadPanel } from '@/components/UploadPanel';
import { RecordPanel } from '@/components/RecordPanel';
import { RecordingRow } from '@/components/RecordingRow';
import { space } from '@/components/theme';
import { ScreenTitle } from '@/components/ScreenTitle';
import { useCandidates, useMe, useRecordings, useSong } from '@/client/hooks';
import { DurationPlanner } from '@/components/DurationPlanner';
import { TakeComparison } from '@/components/TakeComparison';
import { EditOrDeleteSong, RecordingActions, SetTempos, TemposSetBy } from '@/components/SongManagement';
import { whose } from '@/shared/format';
import { PracticeEntryForm } from '@/components/PracticeEntryForm';
import { PracticeProgress } from '@/components/PracticeProgress';
import { PracticeLog } from '@/components/PracticeLog';

export default function SongScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const router = useRouter();
  const { song, error } = useSong(id);
  const { recordings } = useRecordings(id);
  const { me } = useMe();
  const { candidates } = useCandidates(id);
  if (error)
    return (
      <Screen>
        <Notice tone="error">This song could not be opened: {error.message}</Notice>
      </Screen>
    );
  if (!song) return <Loading />;
  return (
    <Screen testID="song">
      <ScreenTitle title={song.title} />
      <Button label="‹ Library" kind="quiet" onPress={() => router.navigate('/')} />
      <View style={{ gap: space.xs }}>
        <Heading>{song.title}</Heading>
        <Small>
          {[
            song.ownerId === me?.id ? null : whose('song', { id: song.ownerId, name: song.ownerName }, me?.id),
            song.composer,
            song.key,
            song.meter,
          ]
            .filter(Boolean)
            .join(' · ')}
        </Small>
      </View>
      <SongTempos working={song.workingBpm} goal={song.goalBpm} chosen={song.chosenBpm} />
      <TemposSetBy song={song} meId={me?.id} />
      {song.permissions.setTempos ? <SetTempos key={`${song.workingBpm}-${song.goalBpm}`} song={song} /> : null}
      {song.permissions.edit ? (
        <EditOrDeleteSong song={song} recordingCount={recordings?.length ?? 0} onDeleted={() => router.replace('/')} />
      ) : null}
      <Heading level={2}>Recordings</Heading>
      {recordings && recordings.length === 0 ? (
        <EmptyState title="No recordings yet">
          Add a reference you are learning from, or a take of your own. Tactus finds its tempo and beats, so you can
          hear it at other tempos with a click.
        </EmptyState>
      ) : null}
      {recordings?.map((r) => (
        <View key={r.id} style={{ gap: space.xs }}>
          <RecordingRow recording={r} onOpen={() => router.navigate(`/recordings/${r.id}`)} />
          {r.permissions.edit ? <RecordingActions recording={r} /> : null}
        </View>
      ))}
      {recordings && recordings.length > 0 ? <TakeComparison song={song} recordings={recordings} /> : null}
      {song.permissions.addReference ? (
        <UploadPanel
          songId={song.id}
          takes={song.permissions.addTake}
          onUploaded={(r) => router.navigate(`/recordings/${r.id}`)}
        />
      ) : null}
      <Heading level={2}>Practice</Heading>
      {song.permissions.edit ? <PracticeEntryForm song={song} /> : null}
      <PracticeProgress song={song} />
      <PracticeLog songId={song.id} />
      {song.permissions.addTake ? (
        <RecordPanel song={song} onKept={(r) => router.navigate(`/recordings/${r.id}`)} />
      ) : null}
      <DurationPlanner song={song} recordings={recordings ?? []} candidateBpms={candidates?.map((c) => c.bpm) ?? []} />
      {song.notes ? <Body muted>{song.notes}</Body> : null}
    </Screen>
  );
}
