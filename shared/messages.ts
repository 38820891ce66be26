// Plain words for what went wrong, in one place: schema errors (server answers and client forms alike), the
// names of fields as a musician reads them, and better-auth's error codes.
import { z } from 'zod';

/** Field names in the API → the words on the screen. */
export const FIELD_LABELS: Record<string, string> = {
  title: 'Title',
  composer: 'Composer or artist',
  key: 'Key',
  meter: 'Time signature',
  goalBpm: 'Goal tempo',
  workingBpm: 'Working tempo',
  chosenBpm: 'Chosen tempo',
  correctedBpm: 'Tempo',
  bpm: 'Tempo',
  startBpm: 'Starting tempo',
  reachedBpm: 'Tempo reached',
  rating: 'Rating',
  note: 'Note',
  notes: 'Notes',
  email: 'E-mail',
  name: 'Name',
  label: 'Name',
  kind: 'Kind',
  file: 'File',
  repetitions: 'Repetitions',
  minutes: 'Minutes',
  startSec: 'Start',
  endSec: 'End',
  startBar: 'First bar',
  endBar: 'Last bar',
  practisedAt: 'Day practised',
};

/** A day field left empty or not a day (the forms hold days as ISO 8601, as a date input does). */
export const DAY_TEXT_PROBLEM = 'choose the day it was played';

const article = (n: number | bigint, unit: string) => `${n} ${unit}${Number(n) === 1 ? '' : 's'}`;

/**
 * zod's own messages ("Invalid input: expected number, received NaN") said plainly. Messages written in a
 * schema win over these; this covers what a schema leaves to zod.
 */
export function plainIssueMessage(issue: z.core.$ZodRawIssue): string | undefined {
  switch (issue.code) {
    case 'invalid_type': {
      if (issue.input === undefined || issue.input === null) return 'this is required';
      if (issue.expected === 'number') return 'enter a number';
      if (issue.expected === 'int') return 'enter a whole number';
      if (issue.expected === 'string') return 'enter some text';
      if (issue.expected === 'boolean') return 'choose yes or no';
      return `enter a ${issue.expected}`;
    }
    case 'too_small': {
      const min = issue.minimum as number;
      if (issue.origin === 'string') return min <= 1 ? 'this is required' : `use at least ${article(min, 'character')}`;
      if (issue.origin === 'array') return `choose at least ${min}`;
      return `must be at least ${min}`;
    }
    case 'too_big': {
      const max = issue.maximum as number;
      if (issue.origin === 'string') return `use at most ${article(max, 'character')}`;
      if (issue.origin === 'array') return `choose at most ${max}`;
      return `must be at most ${max}`;
    }
    case 'invalid_format':
      if (issue.format === 'email') return 'enter an e-mail address such as name@example.com';
      if (issue.format === 'datetime') return 'give a date and time such as 2026-11-30T12:00:00Z';
      return 'this is not in the expected form';
    case 'invalid_value':
      return `choose one of: ${issue.values.map(String).join(', ')}`;
    case 'not_multiple_of':
      return 'enter a whole number';
    case 'unrecognized_keys':
      return `unexpected ${issue.keys.length === 1 ? 'field' : 'fields'}: ${issue.keys.join(', ')}`;
    default:
      return undefined;
  }
}

z.config({ customError: (issue) => plainIssueMessage(issue) });

/** "goalBpm: must be at most 300" (as the API answers) → "Goal tempo: must be at most 300" for the screen. */
export function plainProblem(message: string, field?: string | null): string {
  if (!field) return message;
  const bare = message.startsWith(`${field}: `) ? message.slice(field.length + 2) : message;
  const label = FIELD_LABELS[field.split('.').pop() ?? field];
  return label ? `${label}: ${bare}` : bare;
}

/** The first problem of each field of a failed parse, in plain words, for a form. */
export function fieldProblems(error: z.ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of error.issues) {
    const field = String(issue.path[0] ?? '');
    out[field] ??= issue.message;
  }
  return out;
}

/** better-auth's codes → what we tell a musician. */
export const AUTH_MESSAGES: Record<string, string> = {
  INVALID_EMAIL_OR_PASSWORD: 'That e-mail and password do not match an account.',
  INVALID_EMAIL: 'Enter an e-mail address such as name@example.com.',
  EMAIL_NOT_VERIFIED: 'Confirm your e-mail first: we have sent you a new link.',
  USER_ALREADY_EXISTS: 'An account with this e-mail already exists. Sign in instead.',
  USER_ALREADY_EXISTS_USE_ANOTHER_EMAIL: 'An account with this e-mail already exists. Sign in instead.',
  PASSWORD_TOO_SHORT: 'Use at least 8 characters for your password.',
  PASSWORD_TOO_LONG: 'Use at most 128 characters for your password.',
  INVALID_TOKEN: 'This link has expired or was already used. Ask for a new one.',
};
