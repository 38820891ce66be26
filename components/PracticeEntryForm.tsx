// Logging a session by hand: what was played (the whole piece or a saved passage), the tempo reached and
// whether it was clean, repetitions, minutes, a note and the day (today unless the session is logged later, up
// to a year back). A clean session above the working tempo then offers to raise it.
import React, { useState } from 'react';
import { View } from 'react-native';
import { space, type } from './theme';
import { Button, Card, Chip, DayField, Field, Heading, Notice, Row, Small } from './ui';
import { RaiseOffer, offerAfter, type Offer } from './RaiseOffer';
import { logPractice, useMe, usePassages } from '@/client/hooks';
import { PRACTICE_BACKDATE_DAYS, PracticeInputSchema, type Song } from '@/shared/schemas';
import { DAY_TEXT_PROBLEM, fieldProblems } from '@/shared/messages';
import { formatBpm, formatDate } from '@/shared/format';
import { dayNumber, dayOf, dayText, localDay, parseDay, practisedAtOf } from '@/audio/practice/practice-log';

/** "92,5" and "92.5" both read as 92.5; blank is left out so the schema names what is missing. */
const num = (s: string) => (s.trim() === '' ? undefined : Number(s.trim().replace(',', '.')));

/** Today and yesterday in the player's time zone, as the day field writes them. */
const todayText = () => dayText(localDay(new Date()));
const yesterdayText = () => dayText(dayOf(dayNumber(localDay(new Date())) - 1));
/** The earliest day the schema takes (its noon is within PRACTICE_BACKDATE_DAYS of now): the picker's lower end. */
const earliestDayText = () => dayText(dayOf(dayNumber(localDay(new Date())) - (PRACTICE_BACKDATE_DAYS - 1)));

/** The day field read back in words under it ("1 Dec 2026"), so a slip in the digits shows before logging. */
function dayInWords(text: string): string | undefined {
  const d = parseDay(text);
  if (!d) return undefined;
  const words = formatDate(new Date(d.year, d.month - 1, d.day, 12));
  return text === todayText() ? `Today, ${words}` : text === yesterdayText() ? `Yesterday, ${words}` : words;
}

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
  const [day, setDay] = useState(todayText);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string | null>(null);
  const [logged, setLogged] = useState<string | null>(null);
  const [offer, setOffer] = useState<Offer | null>(null);

  /** A new day is read back under the field at once, in place of the last one's problem. */
  const changeDay = (text: string) => {
    setDay(text);
    setErrors(({ practisedAt: _, ...others }) => others);
  };

  const submit = async () => {
    setProblem(null);
    setLogged(null);
    setOffer(null);
    const reachedBpm = num(reached);
    const played = parseDay(day);
    const parsed = PracticeInputSchema.safeParse({
      passageId,
      reachedBpm,
      // Without a starting tempo the session is taken as played at the tempo reached.
      startBpm: num(started) ?? reachedBpm,
      clean,
      repetitions: num(repetitions),
      minutes: num(minutes),
      note: note.trim() || null,
      practisedAt: played ? practisedAtOf(played) : undefined,
    });
    if (!parsed.success || !played) {
      const problems: Record<string, string> = parsed.error ? fieldProblems(parsed.error) : {};
      if (!played) problems.practisedAt = DAY_TEXT_PROBLEM;
      return setErrors(problems);
    }
    setErrors({});
    try {
      const entry = await logPractice(song.id, parsed.data);
      const where = passages?.find((p) => p.id === entry.passageId)?.name ?? 'the whole piece';
      const on = parsed.data.practisedAt ? ` for ${formatDate(entry.createdAt)}` : '';
      setLogged(`Logged${on}: ${where} at ${formatBpm(entry.reachedBpm)} BPM${entry.clean ? ', clean' : ''}.`);
      setOffer(offerAfter(entry, song, passages ?? [], me?.id));
      setReached('');
      setStarted('');
      setRepetitions('');
      setMinutes('');
      setNote('');
      // The next session is today's unless the player says otherwise again.
      setDay(todayText());
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
      <Row align="flex-start">
        <DayField
          label="Day practised"
          value={day}
          onChangeText={changeDay}
          min={earliestDayText()}
          max={todayText()}
          error={errors.practisedAt}
          hint={dayInWords(day)}
          testID="log-day"
        />
        {/* Level with the field's box: below its label line and the gap under it. */}
        <View style={{ flexDirection: 'row', gap: space.sm, paddingTop: type.label.lineHeight + space.xs }}>
          <Chip
            label="Today"
            selected={day === todayText()}
            onPress={() => changeDay(todayText())}
            testID="log-today"
          />
          <Chip
            label="Yesterday"
            selected={day === yesterdayText()}
            onPress={() => changeDay(yesterdayText())}
            testID="log-yesterday"
          />
        </View>
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
