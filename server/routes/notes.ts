import { Router } from 'express';
import { handler, parseBody } from '@/server/http';
import { currentUser, requireUser } from '@/server/middleware/session';
import { NoteInputSchema, NotePatchSchema, ReplyInputSchema } from '@/shared/schemas';
import { addNote, deleteNote, listNotes, replyToNote, updateNote } from '@/server/services/notes';

/** Mounted at /api/recordings/:recordingId/notes. */
export const recordingNotesRouter = Router({ mergeParams: true });
recordingNotesRouter.use(requireUser);

recordingNotesRouter.get(
  '/',
  handler(async (req, res) => {
    res.json({ notes: await listNotes(currentUser(req), String(req.params.recordingId)) });
  }),
);

recordingNotesRouter.post(
  '/',
  handler(async (req, res) => {
    const input = parseBody(NoteInputSchema, req.body);
    res.status(201).json(await addNote(currentUser(req), String(req.params.recordingId), input));
  }),
);

/** Mounted at /api/notes. */
export const notesRouter = Router();
notesRouter.use(requireUser);

notesRouter.post(
  '/:id/replies',
  handler(async (req, res) => {
    const { text } = parseBody(ReplyInputSchema, req.body);
    res.status(201).json(await replyToNote(currentUser(req), String(req.params.id), text));
  }),
);

notesRouter.patch(
  '/:id',
  handler(async (req, res) => {
    const patch = parseBody(NotePatchSchema, req.body);
    res.json(await updateNote(currentUser(req), String(req.params.id), patch));
  }),
);

notesRouter.delete(
  '/:id',
  handler(async (req, res) => {
    await deleteNote(currentUser(req), String(req.params.id));
    res.status(204).end();
  }),
);
