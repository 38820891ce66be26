// Adding a recording to a song: pick a file, say whose it is (reference or take), label it, send it with a
// real progress bar. What happens next (the analysis) shows in the song's list of recordings.
import React, { useState } from 'react';
import { Pressable, Text, View } from 'react-native';
import { mutate } from 'swr';
import { Button, Card, Field, Heading, Notice, Small } from './ui';
import { FilePicker } from './FilePicker';
import { ProgressBar } from './ProgressBar';
import { colors, layout, radius, space, type } from './theme';
import { uploadRecording } from '@/client/upload';
import type { Recording, RecordingKind } from '@/shared/schemas';

const kinds: { value: RecordingKind; label: string; hint: string }[] = [
  {
    value: 'take',
    label: 'My take',
    hint: 'You playing: Tactus shows how steady it is (drift, beat-to-beat variation, the bars that rush or drag) and compares it with your other takes.',
  },
  { value: 'reference', label: 'Reference', hint: 'Someone else’s recording you learn from.' },
];

export function UploadPanel({
  songId,
  onUploaded,
  takes = true,
}: {
  songId: string;
  onUploaded: (r: Recording) => void;
  /** False for a teacher: references only. */ takes?: boolean;
}) {
  const [file, setFile] = useState<File | null>(null);
  const [kind, setKind] = useState<RecordingKind>(takes ? 'take' : 'reference');
  const [label, setLabel] = useState('');
  const [progress, setProgress] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);

  const send = async () => {
    if (!file) return;
    setError(null);
    setProgress(0);
    try {
      const r = await uploadRecording(songId, file, { kind, label: label.trim() || undefined }, setProgress);
      await mutate(`/api/songs/${songId}/recordings`);
      setFile(null);
      setLabel('');
      onUploaded(r);
    } catch (e) {
      setError((e as Error).message);
    } finally {
      setProgress(null);
    }
  };

  return (
    <Card testID="upload-panel">
      <Heading level={3}>Add a recording</Heading>
      <FilePicker onPick={setFile} fileName={file?.name} testID="file-input" />
      <View
        style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}
        role="radiogroup"
        aria-label="Whose recording"
      >
        {kinds
          .filter((k) => takes || k.value === 'reference')
          .map((k) => (
            <Pressable
              key={k.value}
              role="radio"
              aria-checked={kind === k.value}
              onPress={() => setKind(k.value)}
              style={{
                minHeight: layout.minTouch,
                justifyContent: 'center',
                paddingHorizontal: space.md,
                borderRadius: radius.sm,
                borderWidth: 1.5,
                borderColor: kind === k.value ? colors.teal : colors.line,
                backgroundColor: kind === k.value ? colors.tealSoft : colors.card,
              }}
            >
              <Text style={[type.label, { color: colors.ink }]}>{k.label}</Text>
            </Pressable>
          ))}
      </View>
      <Small>{kinds.find((k) => k.value === kind)!.hint}</Small>
      <Field
        label="Label (optional)"
        value={label}
        onChangeText={setLabel}
        placeholder="e.g. Tuesday run-through"
        testID="recording-label"
      />
      {progress !== null ? (
        <View style={{ gap: space.xs }}>
          <ProgressBar value={progress} label="Upload progress" testID="upload-progress" />
          <Small>Uploading… {Math.round(progress * 100)} %</Small>
        </View>
      ) : null}
      {error ? <Notice tone="error">{error}</Notice> : null}
      <Button label="Upload and analyse" onPress={send} disabled={!file} busy={progress !== null} testID="upload" />
    </Card>
  );
}
