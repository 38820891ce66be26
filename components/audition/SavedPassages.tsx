// The recording's saved passages ("bridge", "bars 57–60"): each with its bars and its working and goal tempo
// (set or cleared here by whoever may set the song's tempos), one tap to loop it, and the loop being played saved
// as a new one under a name.
import React, { useState } from 'react';
import { Text, View } from 'react-native';
import { Button, Chip, Field, Notice, Row, Small } from '@/components/ui';
import { colors, radius, space, type } from '@/components/theme';
import { addPassage, removePassage, setPassageTempos } from '@/client/hooks';
import { useAction } from '@/client/useAction';
import { barsOf, type Passage as Region } from '@/audio/practice/passage';
import { formatBpm } from '@/shared/format';
import { BpmSchema, type Passage } from '@/shared/schemas';

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
  canSetTempos,
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
  /** May set the passages' working and goal tempo (the player, or their teacher). */
  canSetTempos: boolean;
  onLoop: (p: Passage) => void;
}) {
  const [name, setName] = useState('');
  /** The passage whose tempos are being edited. */
  const [editing, setEditing] = useState<string | null>(null);
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
            <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
              <Chip
                label={on ? 'Looping' : 'Loop'}
                selected={on}
                hint={`Loop ${p.name}`}
                onPress={() => onLoop(p)}
                testID={`loop-passage-${p.name}`}
              />
              {canSetTempos ? (
                <Chip
                  label="Tempos"
                  selected={editing === p.id}
                  hint={`Set the working and goal tempo of ${p.name}`}
                  onPress={() => setEditing(editing === p.id ? null : p.id)}
                  testID={`passage-tempos-${p.name}`}
                  compact
                />
              ) : null}
              {canEdit ? (
                <Chip label="Delete" hint={`Delete ${p.name}`} onPress={() => void remove(p)} compact />
              ) : null}
            </View>
            {editing === p.id ? <PassageTempos passage={p} onDone={() => setEditing(null)} /> : null}
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

/** Reads a tempo field: empty clears the tempo; anything else must be a tempo in BPM (a comma reads as a point). */
function readBpm(text: string, what: string): { bpm: number | null } | { problem: string } {
  if (text.trim() === '') return { bpm: null };
  const parsed = BpmSchema.safeParse(Number(text.trim().replace(',', '.')));
  if (parsed.success) return { bpm: parsed.data };
  // "tempo must be at least 30 BPM" reads "Working tempo must be at least 30 BPM"; "enter a number" keeps a colon.
  const message = parsed.error.issues[0]!.message;
  return { problem: message.startsWith('tempo ') ? `${what} ${message.slice(6)}` : `${what}: ${message}` };
}

/** The passage's own working and goal tempo; an empty field clears it. */
function PassageTempos({ passage, onDone }: { passage: Passage; onDone: () => void }) {
  const [working, setWorking] = useState(passage.workingBpm === null ? '' : String(passage.workingBpm));
  const [goal, setGoal] = useState(passage.goalBpm === null ? '' : String(passage.goalBpm));
  const [problem, setProblem] = useState<string | null>(null);
  const save = useAction(async () => {
    const w = readBpm(working, 'Working tempo');
    const g = readBpm(goal, 'Goal');
    if ('problem' in w) return setProblem(w.problem);
    if ('problem' in g) return setProblem(g.problem);
    setProblem(null);
    await setPassageTempos(passage, { workingBpm: w.bpm, goalBpm: g.bpm });
    onDone();
  });
  return (
    <View style={{ flexBasis: '100%', gap: space.sm }} testID={`passage-tempo-editor-${passage.name}`}>
      <Row align="flex-end">
        <Field
          label="Working (BPM)"
          value={working}
          onChangeText={setWorking}
          inputMode="decimal"
          placeholder="none"
          testID="passage-working"
        />
        <Field
          label="Goal (BPM)"
          value={goal}
          onChangeText={setGoal}
          inputMode="decimal"
          placeholder="none"
          testID="passage-goal"
        />
        <Button
          label="Save tempos"
          kind="secondary"
          busy={save.busy}
          onPress={() => void save.run()}
          testID="save-passage-tempos"
        />
      </Row>
      <Small>Leave a field empty to clear that tempo.</Small>
      {(problem ?? save.error) ? <Notice tone="error">{problem ?? save.error}</Notice> : null}
    </View>
  );
}
