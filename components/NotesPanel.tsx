// Notes on a recording between a player and their teacher: at a moment ("0:42") or on bars ("9–12"), with
// replies, open or resolved. Tapping a note's place hands it to the player (seek there, or loop the bars).
import React, { useState } from 'react';
import { View } from 'react-native';
import { Body, Button, Card, Chip, Field, Heading, Notice, Row, Small } from './ui';
import { colors, radius, space } from './theme';
import { addNote, changeNote, deleteNote, replyToNote, useNotes } from '@/client/hooks';
import { barsToRegion } from '@/audio/practice/passage';
import { formatClock, formatDateTime, parseClock, plural } from '@/shared/format';
import type { Note, Recording } from '@/shared/schemas';

interface Props {
  recording: Recording;
  /** Move the player there (a moment), or loop the region (a passage). */
  onSeek?: (sec: number) => void;
  onLoop?: (start: number, end: number) => void;
}

/** A moment as a player says it: "0:42", or "0:42.5" when it falls between seconds. */
const moment = (sec: number) => formatClock(sec).replace(/\.0$/, '');

export const noteWhere = (n: Pick<Note, 'atSec' | 'startSec' | 'endSec' | 'startBar' | 'endBar'>) =>
  n.atSec != null
    ? `at ${moment(n.atSec)}`
    : n.startBar != null
      ? n.endBar === n.startBar
        ? `bar ${n.startBar}`
        : `bars ${n.startBar}–${n.endBar}`
      : `${moment(n.startSec ?? 0)}–${moment(n.endSec ?? 0)}`;

export function NotesPanel({ recording: r, onSeek, onLoop }: Props) {
  const { notes } = useNotes(r.id);
  const [showResolved, setShowResolved] = useState(false);
  const open = notes?.filter((n) => !n.resolved) ?? [];
  const resolved = notes?.filter((n) => n.resolved) ?? [];
  return (
    <Card testID="notes">
      <Heading level={3}>Notes</Heading>
      {notes && notes.length === 0 ? (
        <Small>No notes yet. A note can mark a moment or a run of bars for the lesson.</Small>
      ) : null}
      {open.map((n) => (
        <NoteThread key={n.id} note={n} recordingId={r.id} onSeek={onSeek} onLoop={onLoop} />
      ))}
      {resolved.length ? (
        <Chip
          label={showResolved ? 'Hide resolved notes' : `Show ${plural(resolved.length, 'resolved note')}`}
          onPress={() => setShowResolved(!showResolved)}
        />
      ) : null}
      {showResolved
        ? resolved.map((n) => <NoteThread key={n.id} note={n} recordingId={r.id} onSeek={onSeek} onLoop={onLoop} />)
        : null}
      {r.permissions.note ? <NewNote recording={r} /> : null}
    </Card>
  );
}

function NoteThread({
  note: n,
  recordingId,
  onSeek,
  onLoop,
}: { note: Note; recordingId: string } & Pick<Props, 'onSeek' | 'onLoop'>) {
  const [replying, setReplying] = useState(false);
  const [editing, setEditing] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const act = (f: () => Promise<void>) => f().catch((e: Error) => setProblem(e.message));
  const go = () =>
    n.atSec != null
      ? onSeek?.(n.atSec)
      : n.startSec != null && n.endSec != null
        ? onLoop?.(n.startSec, n.endSec)
        : undefined;
  return (
    <View
      testID="note"
      style={{
        gap: space.xs,
        padding: space.md,
        borderRadius: radius.sm,
        borderWidth: 1,
        borderColor: n.resolved ? colors.line : colors.teal,
      }}
    >
      <Row>
        <Chip
          label={noteWhere(n)}
          onPress={go}
          hint={n.atSec != null ? 'Play from here' : 'Loop these bars'}
          testID="note-place"
          compact
        />
        <Small>
          {n.author.name} · {formatDateTime(n.createdAt)}
          {n.resolved ? ' · resolved' : ''}
        </Small>
      </Row>
      {!editing ? (
        <Body>{n.text}</Body>
      ) : (
        <NoteTextForm
          label="Your note"
          initial={n.text}
          sendLabel="Save"
          testID="note-edit"
          onSend={(text) =>
            act(async () => {
              await changeNote(recordingId, n.id, { text });
              setEditing(false);
            })
          }
          onCancel={() => setEditing(false)}
        />
      )}
      {n.replies.map((rep) => (
        <View key={rep.id} style={{ marginLeft: space.lg, gap: 2 }} testID="note-reply">
          <Small>
            {rep.author.name} · {formatDateTime(rep.createdAt)}
          </Small>
          <Body>{rep.text}</Body>
        </View>
      ))}
      {replying ? (
        <NoteTextForm
          label="Your reply"
          initial=""
          sendLabel="Send the reply"
          testID="note-reply"
          onSend={(text) =>
            act(async () => {
              await replyToNote(recordingId, n.id, text);
              setReplying(false);
            })
          }
          onCancel={() => setReplying(false)}
        />
      ) : null}
      <Row>
        {!replying ? (
          <Button label="Reply" kind="quiet" onPress={() => setReplying(true)} testID="note-reply-open" />
        ) : null}
        <Button
          label={n.resolved ? 'Reopen' : 'Mark resolved'}
          kind="quiet"
          onPress={() => act(() => changeNote(recordingId, n.id, { resolved: !n.resolved }))}
        />
        {n.mine && !editing ? (
          <Button label="Edit" kind="quiet" onPress={() => setEditing(true)} testID="note-edit" />
        ) : null}
        {n.mine ? (
          <Button label="Delete" kind="quiet" onPress={() => act(() => deleteNote(recordingId, n.id))} />
        ) : null}
      </Row>
      {problem ? <Notice tone="error">{problem}</Notice> : null}
    </View>
  );
}

/** A text box with send and cancel, for editing a note or replying to it; sends the text trimmed. */
function NoteTextForm({
  label,
  initial,
  sendLabel,
  testID,
  onSend,
  onCancel,
}: {
  label: string;
  initial: string;
  sendLabel: string;
  testID: string;
  onSend: (text: string) => void;
  onCancel: () => void;
}) {
  const [text, setText] = useState(initial);
  return (
    <View style={{ gap: space.sm }}>
      <Field label={label} value={text} onChangeText={setText} multiline testID={`${testID}-text`} />
      <Row>
        <Button
          label={sendLabel}
          kind="secondary"
          disabled={!text.trim()}
          onPress={() => onSend(text.trim())}
          testID={`${testID}-send`}
        />
        <Button label="Cancel" kind="quiet" onPress={onCancel} />
      </Row>
    </View>
  );
}

/** A new note: at a moment typed as m:ss, or on a run of bars of this recording's grid. */
function NewNote({ recording: r }: { recording: Recording }) {
  const [kind, setKind] = useState<'moment' | 'bars'>('moment');
  const [at, setAt] = useState('');
  const [fromBar, setFromBar] = useState('');
  const [toBar, setToBar] = useState('');
  const [text, setText] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const submit = async () => {
    setProblem(null);
    let place: object;
    if (kind === 'moment') {
      const sec = parseClock(at);
      if (sec === null) return setProblem('Write the moment as minutes:seconds, such as 0:42.');
      place = { atSec: sec };
    } else {
      const first = Number(fromBar);
      const last = Number(toBar || fromBar);
      const region = barsToRegion(first, last, r.analysis?.downbeats ?? [], r.durationSec);
      if (!region)
        return setProblem(
          `Give bars this recording has (1 to ${r.analysis?.downbeats.length ?? 0}), the first before the last.`,
        );
      place = { startSec: region.start, endSec: region.end, startBar: first, endBar: last };
    }
    setBusy(true);
    try {
      await addNote(r.id, { text: text.trim(), ...place });
      setText('');
    } catch (e) {
      setProblem((e as Error).message);
    } finally {
      setBusy(false);
    }
  };
  return (
    <View style={{ gap: space.sm, marginTop: space.sm }} testID="new-note">
      <Body style={{ fontWeight: '700' }}>Add a note</Body>
      <Row>
        <Chip
          label="At a moment"
          selected={kind === 'moment'}
          onPress={() => setKind('moment')}
          testID="note-kind-moment"
        />
        <Chip
          label="On bars"
          selected={kind === 'bars'}
          onPress={() => setKind('bars')}
          disabled={!r.analysis?.downbeats.length}
          testID="note-kind-bars"
        />
      </Row>
      {kind === 'moment' ? (
        <Field label="At (m:ss)" value={at} onChangeText={setAt} placeholder="0:42" testID="note-at" />
      ) : (
        <Row>
          <Field
            label="From bar"
            value={fromBar}
            onChangeText={setFromBar}
            inputMode="numeric"
            testID="note-from-bar"
          />
          <Field label="To bar" value={toBar} onChangeText={setToBar} inputMode="numeric" testID="note-to-bar" />
        </Row>
      )}
      <Field label="Note" value={text} onChangeText={setText} multiline testID="note-text" />
      {problem ? <Notice tone="error">{problem}</Notice> : null}
      <Button label="Add the note" onPress={submit} busy={busy} disabled={!text.trim()} testID="note-add" />
    </View>
  );
}
