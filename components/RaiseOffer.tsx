// After a clean session above the working tempo: the offer to raise it (song or passage, whichever was played),
// one tap to accept, and Undo to put the previous tempo back. The rule is audio/practice/progress.ts.
import React, { useState } from 'react';
import { View } from 'react-native';
import { Button, Notice, Row, Small } from './ui';
import { space } from './theme';
import { setPassageTempos, setSongTempos } from '@/client/hooks';
import { raiseOffer } from '@/audio/practice/progress';
import { formatBpm } from '@/shared/format';
import type { Passage, PracticeEntryDto, Song } from '@/shared/schemas';

export interface Offer {
  /** The song's working tempo, or a saved passage's. */
  on: { kind: 'song'; songId: string } | { kind: 'passage'; passage: Pick<Passage, 'id' | 'songId' | 'name'> };
  fromBpm: number | null;
  toBpm: number;
  /** Who set the working tempo being replaced, when it was someone else (a teacher). */
  setBy: string | null;
}

type Tempos = { workingBpm: number | null; goalBpm: number | null; workingSetBy: { id: string; name: string } | null };

/** The offer a logged entry earns, if any: on its saved passage when it was played on one, else on the song
 * (a loop that is not saved as a passage has no working tempo of its own; the player decides whether it speaks
 * for the song). */
export function offerAfter(
  entry: Pick<PracticeEntryDto, 'clean' | 'reachedBpm' | 'passageId'>,
  song: Song,
  passages: Passage[],
  meId: string | undefined,
): Offer | null {
  const passage = entry.passageId ? passages.find((p) => p.id === entry.passageId) : null;
  if (entry.passageId && !passage) return null;
  const tempos: Tempos = passage ?? song;
  const toBpm = raiseOffer(entry, tempos);
  if (toBpm === null) return null;
  return {
    on: passage ? { kind: 'passage', passage } : { kind: 'song', songId: song.id },
    fromBpm: tempos.workingBpm,
    toBpm,
    setBy: tempos.workingSetBy && tempos.workingSetBy.id !== meId ? tempos.workingSetBy.name : null,
  };
}

/** Raise to a tempo, or undo the raise: the server puts back the tempo it replaced, with who set it. */
const setWorking = (on: Offer['on'], change: { workingBpm: number } | { undoWorking: true }) =>
  on.kind === 'song' ? setSongTempos(on.songId, change) : setPassageTempos(on.passage, change);

export function RaiseOffer({ offer, onDone }: { offer: Offer; onDone: () => void }) {
  const [state, setState] = useState<'offered' | 'raised' | 'undone'>('offered');
  const [problem, setProblem] = useState<string | null>(null);
  const what = offer.on.kind === 'song' ? 'the working tempo' : `the working tempo of “${offer.on.passage.name}”`;
  const act = (change: Parameters<typeof setWorking>[1], next: typeof state) => {
    setProblem(null);
    setWorking(offer.on, change).then(
      () => setState(next),
      (e: Error) => setProblem(e.message),
    );
  };
  const now =
    offer.fromBpm === null
      ? 'There is no working tempo yet.'
      : `Now ${formatBpm(offer.fromBpm)} BPM${offer.setBy ? `, set by ${offer.setBy}` : ''}.`;
  return (
    <View style={{ gap: space.xs }} testID="raise-offer">
      {state === 'offered' ? (
        <>
          <Small muted={false}>
            That was clean at {formatBpm(offer.toBpm)} BPM. {now}
          </Small>
          <Row>
            <Button
              label={`Raise ${what} to ${formatBpm(offer.toBpm)} BPM`}
              kind="secondary"
              onPress={() => act({ workingBpm: offer.toBpm }, 'raised')}
              testID="accept-raise"
            />
            <Button label="Not now" kind="quiet" onPress={onDone} testID="decline-raise" />
          </Row>
        </>
      ) : state === 'raised' ? (
        <>
          <Notice tone="success">
            Raised {what} to {formatBpm(offer.toBpm)} BPM.
          </Notice>
          <Button label="Undo" kind="quiet" onPress={() => act({ undoWorking: true }, 'undone')} testID="undo-raise" />
        </>
      ) : (
        <Notice tone="info">
          {offer.fromBpm === null
            ? `${what[0]!.toUpperCase()}${what.slice(1)} is unset again.`
            : `${what[0]!.toUpperCase()}${what.slice(1)} is back at ${formatBpm(offer.fromBpm)} BPM.`}
        </Notice>
      )}
      {problem ? <Notice tone="error">{problem}</Notice> : null}
    </View>
  );
}
