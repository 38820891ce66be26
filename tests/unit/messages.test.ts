// What a musician reads when a form or request is refused: zod's default wording replaced by plain words,
// field names as the screen names them (shared/messages.ts), for server answers and client forms alike.
import { z } from 'zod';
import { InviteStudentSchema, PracticeInputSchema, SongInputSchema } from '@/shared/schemas';
import { fieldProblems, plainProblem } from '@/shared/messages';

const problems = (schema: z.ZodType, input: unknown) => {
  const r = schema.safeParse(input);
  if (r.success) throw new Error('expected the input to be refused');
  return fieldProblems(r.error);
};

test('a number field given something that is not a number asks for a number', () => {
  // What Number('abc') gives a form: NaN, which zod reports as "expected number, received NaN".
  expect(problems(SongInputSchema, { title: 'Reel', goalBpm: Number('abc') }).goalBpm).toBe('enter a number');
});

test('a missing required field says so, and a schema’s own message wins over the default', () => {
  expect(problems(SongInputSchema, {}).title).toBe('this is required');
  expect(problems(SongInputSchema, { title: '  ' }).title).toBe('give the song a title');
  expect(problems(SongInputSchema, { title: 'Reel', goalBpm: 400 }).goalBpm).toBe('tempo must be at most 300 BPM');
});

test('an e-mail address that is not one gets an example, not the field name twice', () => {
  expect(problems(InviteStudentSchema, { email: 'ilya at example' }).email).toBe(
    'enter an e-mail address such as name@example.com',
  );
});

test('unexpected fields are named; whole numbers are asked for where a count is expected', () => {
  const base = { startBpm: 90, reachedBpm: 96, repetitions: 3, minutes: 10, clean: true };
  expect(problems(PracticeInputSchema, { ...base, colour: 'red' })['']).toBe('unexpected field: colour');
  expect(problems(PracticeInputSchema, { ...base, repetitions: 2.5 }).repetitions).toBe('enter a whole number');
});

test('an API answer "field: message" reads with the field as the screen names it', () => {
  expect(plainProblem('email: enter an e-mail address such as name@example.com', 'email')).toBe(
    'E-mail: enter an e-mail address such as name@example.com',
  );
  expect(plainProblem('goalBpm: tempo must be at most 300 BPM', 'goalBpm')).toBe(
    'Goal tempo: tempo must be at most 300 BPM',
  );
  expect(plainProblem('the waveform is not ready yet')).toBe('the waveform is not ready yet');
});
