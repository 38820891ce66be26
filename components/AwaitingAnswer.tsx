// What waits for a teacher's answer from a student (GET /api/students, `awaiting`): the flag on the student's
// card, and the words of the take and note chips that lead to it.
import React from 'react';
import { Text, View } from 'react-native';
import { colors, radius, space, type } from './theme';
import { formatDate, plural } from '@/shared/format';
import type { Student } from '@/shared/schemas';

type Take = Student['songs'][number]['recentTakes'][number];

/** "1 take and 2 notes wait for your answer"; null when nothing waits. */
export function awaitingWords(a: Student['awaiting']): string | null {
  const parts = [a.takes ? plural(a.takes, 'take') : null, a.notes ? plural(a.notes, 'note') : null].filter(Boolean);
  if (parts.length === 0) return null;
  return `${parts.join(' and ')} ${a.takes + a.notes === 1 ? 'waits' : 'wait'} for your answer`;
}

/** A take's chip: its name and day, and "new" while it waits for the teacher's first word on it. */
export const takeChipLabel = (t: Take) =>
  `${t.label ?? 'Take'} · ${formatDate(t.createdAt)}${t.awaitingAnswer ? ' · new' : ''}`;

/** A recording's chip for its notes that wait: "2 notes to answer on Take 3". */
export const notesChipLabel = (n: { label: string | null; notes: number }) =>
  `${plural(n.notes, 'note')} to answer on ${n.label ?? 'a recording'}`;

/** The flag at the top of a student's card, amber like the other things that ask for attention; nothing when
 * nothing waits. */
export function AwaitingFlag({ awaiting }: { awaiting: Student['awaiting'] }) {
  const words = awaitingWords(awaiting);
  if (!words) return null;
  return (
    <View
      testID="student-awaiting"
      style={{
        alignSelf: 'flex-start',
        flexDirection: 'row',
        alignItems: 'center',
        gap: space.sm,
        backgroundColor: colors.amberSoft,
        borderRadius: radius.sm,
        paddingHorizontal: space.md,
        paddingVertical: space.xs,
      }}
    >
      <View style={{ width: 8, height: 8, borderRadius: 4, backgroundColor: colors.amber }} />
      <Text style={[type.label, { color: colors.ink }]}>{words}</Text>
    </View>
  );
}
