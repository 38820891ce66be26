import { Router } from 'express';
import { handler, parseBody, parseQuery } from '@/server/http';
import { currentUser, requireUser } from '@/server/middleware/session';
import { SongInputSchema, SongListQuerySchema, SongPatchSchema, SongTemposSchema } from '@/shared/schemas';
import { createSong, deleteSong, getSong, listSongs, setSongTempos, updateSong } from '@/server/services/songs';

export const songsRouter = Router();
songsRouter.use(requireUser);

/** The library: ?q= (title or composer/artist), ?sort=, ?status=learning|ready. */
songsRouter.get(
  '/',
  handler(async (req, res) => {
    res.json({ songs: await listSongs(currentUser(req), parseQuery(SongListQuerySchema, req.query)) });
  }),
);

songsRouter.post(
  '/',
  handler(async (req, res) => {
    const input = parseBody(SongInputSchema, req.body);
    res.status(201).json(await createSong(currentUser(req), input));
  }),
);

songsRouter.get(
  '/:id',
  handler(async (req, res) => {
    res.json(await getSong(currentUser(req), String(req.params.id)));
  }),
);

songsRouter.patch(
  '/:id',
  handler(async (req, res) => {
    const patch = parseBody(SongPatchSchema, req.body);
    res.json(await updateSong(currentUser(req), String(req.params.id), patch));
  }),
);

songsRouter.delete(
  '/:id',
  handler(async (req, res) => {
    await deleteSong(currentUser(req), String(req.params.id));
    res.status(204).end();
  }),
);

/** Working and goal tempo: the player's, or set for them by their linked teacher. */
songsRouter.patch(
  '/:id/tempos',
  handler(async (req, res) => {
    const tempos = parseBody(SongTemposSchema, req.body);
    res.json(await setSongTempos(currentUser(req), String(req.params.id), tempos));
  }),
);
