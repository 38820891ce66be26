// Who may read and who may write each kind of thing: the one place the rule is written. Every service asks
// here; no route or other service repeats it. Someone who may not read a thing is told it does not exist
// (404), so ids reveal nothing; someone who may read but not write gets the same answer for a write.
import { StudioLink } from '@/server/models';
import { HttpError, notFound } from '@/server/http';
import type { Me } from '@/shared/schemas';

/** How the person asking stands to the owner of the thing. */
export type Relation = 'owner' | 'linked-teacher' | 'admin' | 'other-user' | 'anonymous';
export type ThingKind =
  | 'song'
  | 'song-tempos'
  | 'reference'
  | 'take'
  | 'recording'
  | 'candidate'
  | 'practice-entry'
  | 'passage'
  | 'note'
  | 'set-list'
  | 'tempo-mark';
export type Action = 'read' | 'write';

/**
 * The table. A linked teacher reads a student's songs, recordings, candidate tempos, passages and practice log; an
 * admin reads everything (support); only the owner changes anything. Other players and teachers who are
 * not linked see nothing; anonymous requests never reach a service (requireUser answers 401 first).
 */
export const ACCESS: Record<ThingKind, Record<Action, readonly Relation[]>> = {
  song: { read: ['owner', 'linked-teacher', 'admin'], write: ['owner'] },
  // A teacher sets a student's working and goal tempo (the student sees who set them) …
  'song-tempos': { read: ['owner', 'linked-teacher', 'admin'], write: ['owner', 'linked-teacher'] },
  // … and may add a reference recording to a student's song; takes are the player's own.
  reference: { read: ['owner', 'linked-teacher', 'admin'], write: ['owner', 'linked-teacher'] },
  take: { read: ['owner', 'linked-teacher', 'admin'], write: ['owner'] },
  recording: { read: ['owner', 'linked-teacher', 'admin'], write: ['owner'] },
  candidate: { read: ['owner', 'linked-teacher', 'admin'], write: ['owner'] },
  'practice-entry': { read: ['owner', 'linked-teacher', 'admin'], write: ['owner'] },
  passage: { read: ['owner', 'linked-teacher', 'admin'], write: ['owner'] },
  // Notes are how a teacher and a student talk about a take: both write (and reply, and resolve). Changing or
  // deleting the words of a note is for its author alone (see assertAuthor).
  note: { read: ['owner', 'linked-teacher', 'admin'], write: ['owner', 'linked-teacher'] },
  // A set list is the player's plan for a gig; their teacher may look at it too.
  'set-list': { read: ['owner', 'linked-teacher', 'admin'], write: ['owner'] },
  // What the player meant as rubato or ritardando in their own recording; the teacher sees it in the report.
  'tempo-mark': { read: ['owner', 'linked-teacher', 'admin'], write: ['owner'] },
};

const NAMES: Record<ThingKind, string> = {
  song: 'song',
  'song-tempos': 'song',
  reference: 'song',
  take: 'song',
  recording: 'recording',
  candidate: 'candidate tempo',
  'practice-entry': 'practice entry',
  passage: 'passage',
  note: 'note',
  'set-list': 'set list',
  'tempo-mark': 'marked passage',
};

export async function relationTo(user: Me | null | undefined, ownerId: string): Promise<Relation> {
  if (!user) return 'anonymous';
  if (user.id === ownerId) return 'owner';
  if (user.role === 'admin') return 'admin';
  if (user.role === 'teacher' && (await StudioLink.count({ where: { teacherId: user.id, studentId: ownerId } })) > 0)
    return 'linked-teacher';
  return 'other-user';
}

/** The table's answer for a relation already known (to ask several questions about one owner with one lookup). */
export const allows = (relation: Relation, action: Action, kind: ThingKind) => ACCESS[kind][action].includes(relation);

export async function may(
  user: Me | null | undefined,
  action: Action,
  kind: ThingKind,
  ownerId: string,
): Promise<boolean> {
  return allows(await relationTo(user, ownerId), action, kind);
}

/** Passes when `user` may do `action` to a `kind` owned by `ownerId`; otherwise "not found". */
export async function assertMay(
  user: Me,
  action: Action,
  kind: ThingKind,
  ownerId: string | null | undefined,
): Promise<void> {
  if (!ownerId || !(await may(user, action, kind, ownerId))) throw notFound(NAMES[kind]);
}

/** The not-found error for a thing that does not exist at all (the same words as a refused one). */
export const missing = (kind: ThingKind) => notFound(NAMES[kind]);

/** Words are their author's: only the author changes or deletes what they wrote. */
export function assertAuthor(user: Me, authorId: string): void {
  if (user.id !== authorId)
    throw new HttpError(403, 'not_author', 'only the person who wrote this can change or delete it');
}
