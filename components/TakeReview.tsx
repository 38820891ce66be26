// A take just played, before it leaves the browser: listen back, an optional label, then keep (uploaded as a WAV
// take of the song and analysed like any upload) or discard. One component for recording against the click
// (RecordPanel) and playing along with a reference (audition/PlayAlongCard).
import React, { useEffect, useState } from 'react';
import { Text, View } from 'react-native';
import { mutate } from 'swr';
import { Button, Field, Notice, Row, Small } from './ui';
import { ProgressBar } from './ProgressBar';
import { colors, space, type } from './theme';
import { takeWav } from '@/audio/live/take';
import { listenBack, type RecordedTake } from '@/client/live-session';
import { uploadRecording } from '@/client/upload';
import { formatDuration } from '@/shared/format';
import type { Recording } from '@/shared/schemas';

export function TakeReview({
  take,
  songId,
  defaultLabel,
  fileName,
  onKept,
  onDiscarded,
}: {
  take: RecordedTake;
  songId: string;
  /** The label a kept take gets when the player writes none. */
  defaultLabel: string;
  fileName: string;
  onKept: (r: Recording) => void;
  onDiscarded: () => void;
}) {
  const [label, setLabel] = useState('');
  const [listening, setListening] = useState<(() => void) | null>(null);
  const [uploading, setUploading] = useState(false);
  const [progress, setProgress] = useState(0);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => () => listening?.(), [listening]);

  const stopListening = () => {
    listening?.();
    setListening(null);
  };

  const keep = async () => {
    stopListening();
    setUploading(true);
    setError(null);
    try {
      const bytes = takeWav(take.samples, take.sampleRate);
      const file = new File([bytes as Uint8Array<ArrayBuffer>], fileName, { type: 'audio/wav' });
      const r = await uploadRecording(songId, file, { kind: 'take', label: label.trim() || defaultLabel }, setProgress);
      await mutate(`/api/songs/${songId}/recordings`);
      onKept(r);
    } catch (e) {
      // The take stays in the browser so it can be sent again.
      setUploading(false);
      setError((e as Error).message);
    }
  };

  return (
    <View style={{ gap: space.sm }} testID="take-review">
      <Text style={[type.label, { color: colors.ink }]}>Take: {formatDuration(take.seconds)}</Text>
      <Row>
        <Button
          label={listening ? 'Stop listening' : 'Listen back'}
          kind="secondary"
          onPress={() => {
            if (listening) return stopListening();
            void listenBack(take, () => setListening(null)).then((stopIt) => setListening(() => stopIt));
          }}
          testID="listen-back"
        />
      </Row>
      <Field label="Label (optional)" value={label} onChangeText={setLabel} testID="take-label" />
      {uploading ? <ProgressBar value={progress} label="Upload progress" /> : null}
      <Row>
        <Button label="Keep and analyse" onPress={() => void keep()} busy={uploading} testID="keep-take" />
        <Button
          label="Discard"
          kind="danger"
          onPress={() => {
            stopListening();
            onDiscarded();
          }}
          disabled={uploading}
          testID="discard-take"
        />
      </Row>
      <Small>Only a kept take leaves this browser.</Small>
      {error ? <Notice tone="error">{error}</Notice> : null}
    </View>
  );
}
