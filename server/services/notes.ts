// Notes on a recording: a teacher and a student talk about a take at a moment or on a passage, reply, and mark
// a note resolved. New notes by someone other than the recording's owner go out in the owner's digest
// (services/digests.ts).
import { Op } from 'sequelize';
import { Recording, RecordingNote, User } from '@/server/models';
import { HttpError } from '@/server/http';
import type { Me, Note, NoteInput, NotePatch, NoteReply } from '@/shared/schemas';
import { assertAuthor, assertMay, missing, type Action } from './access';
import { recordingFor } from './recordings';
import { pokeDigests } from './digests';

type WithAuthor = RecordingNote & { author?: User };

const toReplyDto = (n: WithAuthor, user: Me): NoteReply => ({
  id: n.id,
  author: { id: n.authorId, name: n.author?.name ?? 'Someone' },
  text: n.text,
  mine: n.authorId === user.id,
  createdAt: n.createdAt.toISOString(),
  updatedAt: n.updatedAt.toISOString(),
});

const toNoteDto = (n: WithAuthor, replies: WithAuthor[], user: Me): Note => ({
  ...toReplyDto(n, user),
  recordingId: n.recordingId,
  atSec: n.atSec,
  startSec: n.startSec,
  endSec: n.endSec,
  startBar: n.startBar,
  endBar: n.endBar,
  resolved: Boolean(n.resolved),
  replies: replies.map((r) => toReplyDto(r, user)),
});

/** A recording's notes in time order (a passage note at its start), each with its replies oldest first. */
export async function listNotes(user: Me, recordingId: string): Promise<Note[]> {
  const r = await recordingFor(user, 'read', recordingId);
  await assertMay(user, 'read', 'note', r.ownerId);
  const all = (await RecordingNote.findAll({
    where: { recordingId: r.id },
    include: [{ model: User, as: 'author', attributes: ['name'] }],
    order: [['createdAt', 'ASC']],
  })) as WithAuthor[];
  const repliesOf = new Map<string, WithAuthor[]>();
  for (const n of all) if (n.parentId) repliesOf.set(n.parentId, [...(repliesOf.get(n.parentId) ?? []), n]);
  const at = (n: RecordingNote) => n.atSec ?? n.startSec ?? 0;
  return all
    .filter((n) => !n.parentId)
    .sort((a, b) => at(a) - at(b))
    .map((n) => toNoteDto(n, repliesOf.get(n.id) ?? [], user));
}

export async function addNote(user: Me, recordingId: string, input: NoteInput): Promise<Note> {
  const r = await recordingFor(user, 'read', recordingId);
  await assertMay(user, 'write', 'note', r.ownerId);
  const end = input.endSec ?? input.atSec ?? 0;
  if (end > r.durationSec + 0.5)
    throw new HttpError(
      400,
      'invalid_body',
      `${input.atSec != null ? 'atSec' : 'endSec'}: must lie within the recording`,
      input.atSec != null ? 'atSec' : 'endSec',
    );
  const n = await RecordingNote.create({
    recordingId: r.id,
    authorId: user.id,
    parentId: null,
    atSec: input.atSec ?? null,
    startSec: input.startSec ?? null,
    endSec: input.endSec ?? null,
    startBar: input.startBar ?? null,
    endBar: input.endBar ?? null,
    text: input.text,
  });
  if (user.id !== r.ownerId) pokeDigests();
  return toNoteDto(Object.assign(n, { author: { name: user.name } as User }), [], user);
}

/** The note (top level or reply) and its recording, when `user` may `action` notes of that recording. */
async function noteFor(user: Me, action: Action, id: string): Promise<{ note: RecordingNote; recording: Recording }> {
  const note = await RecordingNote.findByPk(id);
  if (!note) throw missing('note');
  const recording = await Recording.findByPk(note.recordingId);
  await assertMay(user, action, 'note', recording?.ownerId);
  return { note, recording: recording! };
}

export async function replyToNote(user: Me, noteId: string, text: string): Promise<NoteReply> {
  const { note, recording } = await noteFor(user, 'write', noteId);
  if (note.parentId) throw new HttpError(400, 'invalid_body', 'reply to the note itself, not to a reply');
  const reply = await RecordingNote.create({
    recordingId: note.recordingId,
    authorId: user.id,
    parentId: note.id,
    atSec: null,
    startSec: null,
    endSec: null,
    startBar: null,
    endBar: null,
    text,
  });
  if (user.id !== recording.ownerId) pokeDigests();
  return toReplyDto(Object.assign(reply, { author: { name: user.name } as User }), user);
}

/** Either side resolves or reopens a note; only its author changes its words. */
export async function updateNote(user: Me, id: string, patch: NotePatch): Promise<NoteReply & { resolved: boolean }> {
  const { note } = await noteFor(user, 'write', id);
  if (patch.text !== undefined) assertAuthor(user, note.authorId);
  if (patch.resolved !== undefined && note.parentId)
    throw new HttpError(400, 'invalid_body', 'resolved: a reply is resolved with its note', 'resolved');
  await note.update(patch);
  const author = await User.findByPk(note.authorId, { attributes: ['name'] });
  return {
    ...toReplyDto(Object.assign(note, { author: author ?? undefined }), user),
    resolved: Boolean(note.resolved),
  };
}

export async function deleteNote(user: Me, id: string): Promise<void> {
  const { note } = await noteFor(user, 'read', id);
  assertAuthor(user, note.authorId);
  await RecordingNote.destroy({ where: { [Op.or]: [{ id: note.id }, { parentId: note.id }] } });
}
