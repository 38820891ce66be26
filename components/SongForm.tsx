import React, { useState } from 'react';
import { View } from 'react-native';
import { Button, Card, Field, Heading, Notice } from './ui';
import { space } from './theme';
import { SongInputSchema, type SongInput } from '@/shared/schemas';
import { fieldProblems } from '@/shared/messages';

const optionalNumber = (s: string) => (s.trim() === '' ? null : Number(s.replace(',', '.')));

/**
 * A song's title, composer, key, time signature, goal and working tempo, new or changed (`initial`). Validated with the same
 * schema as the server.
 */
export function SongForm({
  onSubmit,
  onCancel,
  initial,
}: {
  onSubmit: (input: SongInput) => Promise<void>;
  onCancel: () => void;
  initial?: SongInput;
}) {
  const text = (n: number | null | undefined) => (n == null ? '' : String(n));
  const [title, setTitle] = useState(initial?.title ?? '');
  const [composer, setComposer] = useState(initial?.composer ?? '');
  const [key, setKey] = useState(initial?.key ?? '');
  const [meter, setMeter] = useState(initial?.meter ?? '4/4');
  const [goal, setGoal] = useState(text(initial?.goalBpm));
  const [working, setWorking] = useState(text(initial?.workingBpm));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [failure, setFailure] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const submit = async () => {
    const parsed = SongInputSchema.safeParse({
      title,
      composer: composer.trim() || null,
      key: key.trim() || null,
      meter,
      goalBpm: optionalNumber(goal),
      workingBpm: optionalNumber(working),
    });
    if (!parsed.success) {
      setErrors(fieldProblems(parsed.error));
      return;
    }
    setErrors({});
    setBusy(true);
    try {
      await onSubmit(parsed.data);
    } catch (e) {
      setFailure((e as Error).message);
    } finally {
      setBusy(false);
    }
  };

  return (
    <Card testID="song-form">
      <Heading level={3}>{initial ? 'Change the song' : 'New song'}</Heading>
      <View style={{ gap: space.md }}>
        <Field label="Title" value={title} onChangeText={setTitle} error={errors.title} testID="song-title" />
        <Field label="Composer or artist" value={composer} onChangeText={setComposer} error={errors.composer} />
        <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap' }}>
          <View style={{ flexGrow: 1, flexBasis: 140 }}>
            <Field
              label="Key"
              value={key}
              onChangeText={setKey}
              error={errors.key}
              hint="e.g. D minor, B♭ major"
              testID="song-key"
            />
          </View>
          <View style={{ flexGrow: 1, flexBasis: 90 }}>
            <Field label="Meter" value={meter} onChangeText={setMeter} error={errors.meter} hint="e.g. 4/4, 3/4, 6/8" />
          </View>
        </View>
        <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap' }}>
          <View style={{ flexGrow: 1, flexBasis: 90 }}>
            <Field
              label="Goal tempo (BPM)"
              value={goal}
              onChangeText={setGoal}
              inputMode="decimal"
              error={errors.goalBpm}
            />
          </View>
          <View style={{ flexGrow: 1, flexBasis: 90 }}>
            <Field
              label="Working tempo (BPM)"
              value={working}
              onChangeText={setWorking}
              inputMode="decimal"
              error={errors.workingBpm}
            />
          </View>
        </View>
        {failure ? <Notice tone="error">{failure}</Notice> : null}
        <View style={{ flexDirection: 'row', gap: space.md }}>
          <Button label="Save song" onPress={submit} busy={busy} testID="save-song" />
          <Button label="Cancel" kind="quiet" onPress={onCancel} />
        </View>
      </View>
    </Card>
  );
}
