// The recording's saved passages ("bridge", "bars 57–60"): each with its bars and its working and goal tempo,
// one tap to loop it, and the loop being played saved as a new one under a name.
import React, { useState } from 'react';
import { Text, View } from 'react-native';
import { Button, Chip, Field, Notice, Row, Small } from '@/components/ui';
import { colors, radius, space, type } from '@/components/theme';
import { addPassage, removePassage } from '@/client/hooks';
import { useAction } from '@/client/useAction';
import { barsOf, type Passage as Region } from '@/audio/practice/passage';
import { formatBpm } from '@/shared/format';
import type { Passage } from '@/shared/schemas';

const barsText = (p: Passage) =>
  p.startBar === null
    ? null
    : p.endBar === null || p.endBar === p.startBar
      ? `bar ${p.startBar}`
      : `bars ${p.startBar}–${p.endBar}`;

export function SavedPassages({
  songId,
  recordingId,
  passages,
  active,
  loop,
  loopLabel,
  downbeats,
  goalBpm,
  canEdit,
  onLoop,
}: {
  songId: string;
  recordingId: string;
  passages: Passage[];
  active: Passage | null;
  loop: Region | null;
  loopLabel: string | null;
  downbeats: number[];
  /** The goal a new passage starts with (the song's). */
  goalBpm: number | null;
  canEdit: boolean;
  onLoop: (p: Passage) => void;
}) {
  const [name, setName] = useState('');
  const save = useAction(async () => {
    if (!loop) return;
    await addPassage(songId, {
      recordingId,
      name: name.trim() || loopLabel || 'passage',
      startSec: loop.start,
      endSec: loop.end,
      ...barsOf(loop, downbeats),
      goalBpm,
    });
    setName('');
  });
  const [removeError, setRemoveError] = useState<string | null>(null);
  const remove = (p: Passage) =>
    removePassage(p).then(
      () => setRemoveError(null),
      (e: Error) => setRemoveError(e.message),
    );
  return (
    <View style={{ gap: space.sm }} testID="saved-passages">
      {passages.length === 0 ? (
        <Small>No saved passages yet. Loop one, name it, and it stays with the song.</Small>
      ) : null}
      {passages.map((p) => {
        const on = active?.id === p.id;
        return (
          <View
            key={p.id}
            testID={`passage-${p.name}`}
            style={{
              flexDirection: 'row',
              flexWrap: 'wrap',
              alignItems: 'center',
              gap: space.sm,
              padding: space.sm,
              borderRadius: radius.sm,
              borderWidth: on ? 2 : 1,
              borderColor: on ? colors.amber : colors.line,
            }}
          >
            <View style={{ flex: 1, minWidth: 150 }}>
              <Text style={[type.label, { color: colors.ink }]}>
                {on ? '▶ ' : ''}
                {p.name}
              </Text>
              <Small>
                {[
                  barsText(p),
                  p.workingBpm !== null ? `working ${formatBpm(p.workingBpm)}` : null,
                  p.goalBpm !== null ? `goal ${formatBpm(p.goalBpm)} BPM` : null,
                ]
                  .filter(Boolean)
                  .join(' · ')}
              </Small>
            </View>
            <Chip
              label={on ? 'Looping' : 'Loop'}
              selected={on}
              hint={`Loop ${p.name}`}
              onPress={() => onLoop(p)}
              testID={`loop-passage-${p.name}`}
            />
            {canEdit ? <Chip label="Delete" hint={`Delete ${p.name}`} onPress={() => void remove(p)} compact /> : null}
          </View>
        );
      })}
      {canEdit && loop && !active ? (
        <Row align="flex-end">
          <View style={{ flex: 1, minWidth: 160 }}>
            <Field
              label="Name this loop"
              value={name}
              onChangeText={setName}
              placeholder={loopLabel ?? 'bridge'}
              testID="passage-name"
              onSubmitEditing={() => void save.run()}
            />
          </View>
          <Button
            label="Save passage"
            kind="secondary"
            busy={save.busy}
            onPress={() => void save.run()}
            testID="save-passage"
          />
        </Row>
      ) : null}
      {save.error ? <Notice tone="error">{save.error}</Notice> : null}
      {removeError ? <Notice tone="error">{removeError}</Notice> : null}
    </View>
  );
}
