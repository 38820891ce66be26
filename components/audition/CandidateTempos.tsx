// Candidate tempos: add the tempo you are hearing, hop between candidates with one tap (or the number keys),
// rate each and write a line on it, then mark one as the song's chosen tempo with a note. A reader who cannot add
// (a teacher on a student's song) hops between the player's candidates and is told where a suggestion goes.
import React, { useState } from 'react';
import { Text, View } from 'react-native';
import { Button, Chip, Field, Notice, Row, Small } from '@/components/ui';
import { colors, radius, space, type } from '@/components/theme';
import { formatBpm, tenth } from '@/shared/format';
import { addCandidate, changeCandidate, chooseTempo, removeCandidate, useCandidates } from '@/client/hooks';
import { useAction } from '@/client/useAction';
import type { Candidate, Song } from '@/shared/schemas';

/** For a reader who cannot add, rate or choose: what they can do here instead. */
export const READER_HINT = {
  none: 'The player has not added candidate tempos yet. To suggest a tempo, try it with the tempo control and say so in a note; working and goal tempos are set on the song screen.',
  some: "Tap a candidate to hear the recording at that tempo. Adding, rating and choosing are the player's; suggest a tempo in a note.",
} as const;

export function CandidateTempos({
  song,
  bpm,
  canEdit,
  wide,
  onHop,
}: {
  song: Song;
  bpm: number;
  canEdit: boolean;
  wide: boolean;
  onHop: (bpm: number) => void;
}) {
  const { candidates } = useCandidates(song.id);
  const add = useAction(async () => {
    await addCandidate(song.id, tenth(bpm));
  });
  const list = candidates ?? [];
  const already = list.some((c) => Math.abs(c.bpm - bpm) < 0.05);
  return (
    <View style={{ gap: space.sm }} testID="candidates">
      <Row>
        {list.map((c, i) => (
          <Chip
            key={c.id}
            testID={`hop-${i + 1}`}
            hint={`Play at ${formatBpm(c.bpm)} BPM`}
            label={`${wide && i < 9 ? `${i + 1} · ` : ''}${formatBpm(c.bpm)}${song.chosenBpm === c.bpm ? ' ★' : ''}`}
            selected={Math.abs(c.bpm - bpm) < 0.05}
            onPress={() => onHop(c.bpm)}
          />
        ))}
        {canEdit ? (
          <Button
            label={`Add ${formatBpm(tenth(bpm))} as a candidate`}
            kind="secondary"
            busy={add.busy}
            disabled={already}
            onPress={add.run}
            testID="add-candidate"
          />
        ) : null}
      </Row>
      {add.error ? <Notice tone="error">{add.error}</Notice> : null}
      {canEdit ? (
        list.length === 0 ? (
          <Small>Try a few tempos, add the ones worth comparing, then hop between them while the music plays.</Small>
        ) : null
      ) : (
        <Small>{READER_HINT[list.length === 0 ? 'none' : 'some']}</Small>
      )}
      {wide && list.length > 1 ? <Small>Keys 1–9 hop between candidates; the music keeps its place.</Small> : null}
      {list.map((c) => (
        <CandidateRow key={c.id} candidate={c} song={song} canEdit={canEdit} current={Math.abs(c.bpm - bpm) < 0.05} />
      ))}
    </View>
  );
}

function CandidateRow({
  candidate: c,
  song,
  canEdit,
  current,
}: {
  candidate: Candidate;
  song: Song;
  canEdit: boolean;
  current: boolean;
}) {
  const [note, setNote] = useState(c.note ?? '');
  const [choosing, setChoosing] = useState(false);
  const [why, setWhy] = useState(song.chosenNote ?? '');
  const saveNote = useAction(() => changeCandidate(c, { note: note.trim() || null }));
  const choose = useAction(async () => {
    await chooseTempo(song.id, c.bpm, why.trim() || null);
    setChoosing(false);
  });
  const chosen = song.chosenBpm === c.bpm;
  return (
    <View
      testID={`candidate-${formatBpm(c.bpm)}`}
      style={{
        borderWidth: 1,
        borderColor: current ? colors.teal : colors.line,
        borderRadius: radius.sm,
        padding: space.md,
        gap: space.sm,
      }}
    >
      <Row>
        <Text style={[type.h3, { color: chosen ? colors.amber : colors.ink }]}>{formatBpm(c.bpm)} BPM</Text>
        {chosen ? <Text style={[type.label, { color: colors.amber }]}>Chosen tempo</Text> : null}
        <Row gap={2}>
          <Small>Rating</Small>
          {[1, 2, 3, 4, 5].map((n) => (
            <Chip
              key={n}
              compact
              // Told apart without colour: a filled star on a dark chip against an outline on a light one, and
              // the count in words beside them.
              label={n <= (c.rating ?? 0) ? '★' : '☆'}
              selected={n <= (c.rating ?? 0)}
              hint={`Rate ${formatBpm(c.bpm)} BPM ${n} of 5`}
              disabled={!canEdit}
              onPress={() => void changeCandidate(c, { rating: c.rating === n ? null : n })}
            />
          ))}
          <Small>{c.rating ? `${c.rating} of 5` : 'not rated'}</Small>
        </Row>
      </Row>
      {canEdit ? (
        <>
          <Field
            label="A line on this tempo"
            value={note}
            onChangeText={setNote}
            onBlur={() => note !== (c.note ?? '') && saveNote.run()}
            onSubmitEditing={saveNote.run}
            placeholder="e.g. the turns breathe here"
            testID={`candidate-note-${formatBpm(c.bpm)}`}
          />
          <Row>
            {!chosen ? (
              <Button
                label="Choose this tempo"
                kind="secondary"
                onPress={() => setChoosing(true)}
                testID={`choose-${formatBpm(c.bpm)}`}
              />
            ) : null}
            <Button label="Remove" kind="quiet" onPress={() => void removeCandidate(c)} />
          </Row>
        </>
      ) : c.note ? (
        <Small>{c.note}</Small>
      ) : null}
      {choosing ? (
        <View style={{ gap: space.sm }}>
          <Field
            label="Why this tempo? (a note for later)"
            value={why}
            onChangeText={setWhy}
            multiline
            testID="chosen-note"
          />
          <Row>
            <Button
              label={`Mark ${formatBpm(c.bpm)} BPM as the chosen tempo`}
              busy={choose.busy}
              onPress={choose.run}
              testID="confirm-choice"
            />
            <Button label="Cancel" kind="quiet" onPress={() => setChoosing(false)} />
          </Row>
        </View>
      ) : null}
      {chosen && song.chosenNote ? <Small>“{song.chosenNote}”</Small> : null}
      {saveNote.error || choose.error ? <Notice tone="error">{saveNote.error ?? choose.error}</Notice> : null}
    </View>
  );
}
