// Choosing an audio file. On the web this is the browser's own file input (the only way a page may read a
// file), styled as one of our buttons.
import React, { useRef } from 'react';
import { Platform, View } from 'react-native';
import { Button, Small } from './ui';

export function FilePicker({
  onPick,
  fileName,
  testID,
}: {
  onPick: (file: File) => void;
  fileName?: string;
  testID?: string;
}) {
  const input = useRef<HTMLInputElement | null>(null);
  if (Platform.OS !== 'web') return <Small>Uploading works in the web app for now.</Small>;
  return (
    <View style={{ gap: 6 }}>
      {React.createElement('input', {
        ref: input,
        type: 'file',
        accept: 'audio/*,.mp3,.wav,.flac,.ogg,.m4a',
        'data-testid': testID,
        style: { display: 'none' },
        onChange: (e: { target: HTMLInputElement }) => {
          const f = e.target.files?.[0];
          if (f) onPick(f);
        },
      })}
      <Button
        label={fileName ? 'Choose another file' : 'Choose an audio file'}
        kind="secondary"
        onPress={() => input.current?.click()}
      />
      {fileName ? (
        <Small muted={false}>{fileName}</Small>
      ) : (
        <Small>MP3, WAV, FLAC, OGG or M4A, up to 200 MB and 20 minutes.</Small>
      )}
    </View>
  );
}
