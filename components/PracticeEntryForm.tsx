// Logging a session by hand: what was played (the whole piece or a saved passage), the tempo reached and
// whether it was clean, repetitions, minutes and a note. A clean session above the working tempo then offers
// to raise it.
import React, { useState } from 'react';
import { View } from 'react-native';
import { Button, Card, Chip, Field, Heading, Notice, Row, Small } from './ui';
import { RaiseOffer, offerAfter, type Offer } from './RaiseOffer';
import { logPractice, useMe, usePassages } from '@/client/hooks';
import { PracticeInputSchema, type Song } from '@/shared/schemas';
import { fieldProblems } from '@/shared/messages';
import { formatBpm } from '@/shared/format';

/** "92,5" and "92.5" both read as 92.5; blank is left out so the schema names what is missing. */
const num = (s: string) => (s.trim() === '' ? undefined : Number(s.trim().replace(',', '.')));

export function PracticeEntryForm({ song }: { song: Song }) {
  const { passages } = usePassages(song.id);
  const { me } = useMe();
  const [passageId, setPassageId] = useState<string | null>(null);
  const [reached, setReached] = useState('');
  const [started, setStarted] = useState('');
  const [clean, setClean] = useState(true);
  const [repetitions, setRepetitions] = useState('');
  const [minutes, setMinutes] = useState('');
  const [note, setNote] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string | null>(null);
  const [logged, setLogged] = useState<string | null>(null);
  const [offer, setOffer] = useState<Offer | null>(null);

  const submit = async () => {
    setProblem(null);
    setLogged(null);
    setOffer(null);
    const reachedBpm = num(reached);
    const parsed = PracticeInputSchema.safeParse({
      passageId,
      reachedBpm,
      // Without a starting tempo the session is taken as played at the tempo reached.
      startBpm: num(started) ?? reachedBpm,
      clean,
      repetitions: num(repetitions),
      minutes: num(minutes),
      note: note.trim() || null,
    });
    if (!parsed.success) return setErrors(fieldProblems(parsed.error));
    setErrors({});
    try {
      const entry = await logPractice(song.id, parsed.data);
      const where = passages?.find((p) => p.id === entry.passageId)?.name ?? 'the whole piece';
      setLogged(`Logged: ${where} at ${formatBpm(entry.reachedBpm)} BPM${entry.clean ? ', clean' : ''}.`);
      setOffer(offerAfter(entry, song, passages ?? [], me?.id));
      setReached('');
      setStarted('');
      setRepetitions('');
      setMinutes('');
      setNote('');
    } catch (e) {
      setProblem((e as Error).message);
    }
  };

  return (
    <Card testID="log-practice">
      <Heading level={3}>Log practice by hand</Heading>
      {passages && passages.length > 0 ? (
        <Row>
          <Chip label="Whole piece" selected={passageId === null} onPress={() => setPassageId(null)} />
          {passages.map((p) => (
            <Chip
              key={p.id}
              label={p.name}
              selected={passageId === p.id}
              onPress={() => setPassageId(p.id)}
              testID={`log-passage-${p.name}`}
            />
          ))}
        </Row>
      ) : null}
      <Row align="flex-start">
        <Field
          label="Tempo reached (BPM)"
          value={reached}
          onChangeText={setReached}
          inputMode="decimal"
          error={errors.reachedBpm}
          testID="log-reached"
        />
        <Field
          label="Started at (BPM)"
          value={started}
          onChangeText={setStarted}
          inputMode="decimal"
          placeholder="as reached"
          error={errors.startBpm}
          testID="log-started"
        />
      </Row>
      <Row align="flex-start">
        <Field
          label="Repetitions"
          value={repetitions}
          onChangeText={setRepetitions}
          inputMode="numeric"
          error={errors.repetitions}
          testID="log-repetitions"
        />
        <Field
          label="Minutes"
          value={minutes}
          onChangeText={setMinutes}
          inputMode="decimal"
          error={errors.minutes}
          testID="log-minutes"
        />
      </Row>
      <Row>
        <Chip label="Clean at that tempo" selected={clean} onPress={() => setClean(true)} testID="log-clean" />
        <Chip label="Not clean yet" selected={!clean} onPress={() => setClean(false)} testID="log-not-clean" />
      </Row>
      <Field
        label="Note (optional)"
        value={note}
        onChangeText={setNote}
        multiline
        error={errors.note}
        testID="log-note"
      />
      <View style={{ alignItems: 'flex-start' }}>
        <Button label="Log practice" onPress={submit} testID="log-submit" />
      </View>
      {problem ? <Notice tone="error">{problem}</Notice> : null}
      {logged ? <Small muted={false}>{logged}</Small> : null}
      {offer ? <RaiseOffer key={`${offer.toBpm}-${logged}`} offer={offer} onDone={() => setOffer(null)} /> : null}
    </Card>
  );
}
