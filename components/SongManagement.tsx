// What can be done to a song beside playing it: who set its tempos, setting working and goal tempo (the player,
// or their teacher), changing the song, and deleting it after one confirmation.
import React, { useState } from 'react';
import { View } from 'react-native';
import { Button, Field, Notice, Row, Small } from './ui';
import { SongForm } from './SongForm';
import { space } from './theme';
import { changeSong, deleteRecording, deleteSong, renameRecording, setSongTempos } from '@/client/hooks';
import { formatBpm, formatDate, plural } from '@/shared/format';
import { BpmSchema, type Recording, type Song } from '@/shared/schemas';

/** "Working tempo set by Marta Quist on 2 Dec 2026", for tempos someone else set (or always, for a teacher). */
export function TemposSetBy({ song, meId }: { song: Song; meId: string | undefined }) {
  const lines = [
    song.workingSetBy && song.workingBpm !== null && (song.workingSetBy.id !== meId || song.ownerId !== meId)
      ? `Working tempo ${formatBpm(song.workingBpm)} set by ${song.workingSetBy.id === meId ? 'you' : song.workingSetBy.name}${song.workingSetAt ? ` on ${formatDate(song.workingSetAt)}` : ''}`
      : null,
    song.goalSetBy && song.goalBpm !== null && (song.goalSetBy.id !== meId || song.ownerId !== meId)
      ? `Goal ${formatBpm(song.goalBpm)} set by ${song.goalSetBy.id === meId ? 'you' : song.goalSetBy.name}${song.goalSetAt ? ` on ${formatDate(song.goalSetAt)}` : ''}`
      : null,
  ].filter(Boolean);
  return lines.length ? <Small>{lines.join(' · ')}</Small> : null;
}

/** Working and goal tempo, for the player or their teacher. */
export function SetTempos({ song }: { song: Song }) {
  const [working, setWorking] = useState(song.workingBpm === null ? '' : String(song.workingBpm));
  const [goal, setGoal] = useState(song.goalBpm === null ? '' : String(song.goalBpm));
  const [problem, setProblem] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const save = async () => {
    setProblem(null);
    setSaved(false);
    const read = (s: string) => (s.trim() === '' ? null : Number(s.replace(',', '.')));
    const w = BpmSchema.nullable().safeParse(read(working));
    const g = BpmSchema.nullable().safeParse(read(goal));
    if (!w.success) return setProblem(`Working tempo: ${w.error.issues[0]!.message}`);
    if (!g.success) return setProblem(`Goal: ${g.error.issues[0]!.message}`);
    try {
      await setSongTempos(song.id, { workingBpm: w.data, goalBpm: g.data });
      setSaved(true);
    } catch (e) {
      setProblem((e as Error).message);
    }
  };
  return (
    <View style={{ gap: space.sm }} testID="set-tempos">
      <Row align="flex-end">
        <Field
          label="Working tempo (BPM)"
          value={working}
          onChangeText={setWorking}
          inputMode="decimal"
          testID="set-working"
        />
        <Field label="Goal (BPM)" value={goal} onChangeText={setGoal} inputMode="decimal" testID="set-goal" />
        <Button label="Set tempos" kind="secondary" onPress={save} testID="save-tempos" />
      </Row>
      {problem ? <Notice tone="error">{problem}</Notice> : null}
      {saved ? (
        <Notice tone="success">Saved. {song.permissions.edit ? '' : 'Your student sees that you set them.'}</Notice>
      ) : null}
    </View>
  );
}

/** Change the song's details, or delete it with everything in it (asked once). */
export function EditOrDeleteSong({
  song,
  recordingCount,
  onDeleted,
}: {
  song: Song;
  recordingCount: number;
  onDeleted: () => void;
}) {
  const [mode, setMode] = useState<'idle' | 'editing' | 'confirming'>('idle');
  const [problem, setProblem] = useState<string | null>(null);
  if (mode === 'editing') {
    return (
      <SongForm
        initial={{
          title: song.title,
          composer: song.composer,
          key: song.key,
          meter: song.meter,
          goalBpm: song.goalBpm,
          workingBpm: song.workingBpm,
        }}
        onCancel={() => setMode('idle')}
        onSubmit={async (input) => {
          await changeSong(song.id, input);
          setMode('idle');
        }}
      />
    );
  }
  return (
    <View style={{ gap: space.sm }}>
      {mode === 'confirming' ? (
        <Notice tone="caution">
          Delete “{song.title}” with {plural(recordingCount, 'recording')}, its passages, candidate tempos and practice
          log? This cannot be undone.
        </Notice>
      ) : null}
      <Row>
        {mode === 'confirming' ? (
          <>
            <Button
              label="Delete for good"
              kind="secondary"
              testID="confirm-delete-song"
              onPress={() => deleteSong(song.id).then(onDeleted, (e: Error) => setProblem(e.message))}
            />
            <Button label="Keep it" kind="quiet" onPress={() => setMode('idle')} />
          </>
        ) : (
          <>
            <Button label="Change the song" kind="quiet" onPress={() => setMode('editing')} testID="edit-song" />
            <Button label="Delete the song…" kind="quiet" onPress={() => setMode('confirming')} testID="delete-song" />
          </>
        )}
      </Row>
      {problem ? <Notice tone="error">{problem}</Notice> : null}
    </View>
  );
}

/** Rename a recording, or delete it and its file (asked once). */
export function RecordingActions({ recording: r }: { recording: Recording }) {
  const [mode, setMode] = useState<'idle' | 'renaming' | 'confirming'>('idle');
  const [label, setLabel] = useState(r.label ?? r.originalName ?? '');
  const [problem, setProblem] = useState<string | null>(null);
  const act = (f: () => Promise<void>) =>
    f().then(
      () => setMode('idle'),
      (e: Error) => setProblem(e.message),
    );
  return (
    <View style={{ gap: space.xs }}>
      {mode === 'renaming' ? (
        <Row align="flex-end">
          <Field label="Name" value={label} onChangeText={setLabel} testID="recording-label" />
          <Button
            label="Save"
            kind="secondary"
            onPress={() => act(() => renameRecording(r, label.trim() || null))}
            testID="save-recording-label"
          />
          <Button label="Cancel" kind="quiet" onPress={() => setMode('idle')} />
        </Row>
      ) : mode === 'confirming' ? (
        <Row>
          <Small muted={false}>Delete this recording, its analysis, passages and notes?</Small>
          <Button
            label="Delete for good"
            kind="secondary"
            onPress={() => act(() => deleteRecording(r))}
            testID="confirm-delete-recording"
          />
          <Button label="Keep it" kind="quiet" onPress={() => setMode('idle')} />
        </Row>
      ) : (
        <Row>
          <Button label="Rename" kind="quiet" onPress={() => setMode('renaming')} testID="rename-recording" />
          <Button label="Delete…" kind="quiet" onPress={() => setMode('confirming')} testID="delete-recording" />
        </Row>
      )}
      {problem ? <Notice tone="error">{problem}</Notice> : null}
    </View>
  );
}
