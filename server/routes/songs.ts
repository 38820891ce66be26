import { Router } from 'express';
import { handler, parseBody } from '@/server/http';
import { currentUser, requireUser } from '@/server/middleware/session';
import { SongInputSchema, SongPatchSchema } from '@/shared/schemas';
import { createSong, deleteSong, listSongs, songFor, toSongDto, updateSong } from '@/server/services/songs';

export const songsRouter = Router();
songsRouter.use(requireUser);

songsRouter.get('/', handler(async (req, res) => {
  res.json({ songs: await listSongs(currentUser(req)) });
}));

songsRouter.post('/', handler(async (req, res) => {
  const input = parseBody(SongInputSchema, req.body);
  res.status(201).json(toSongDto(await createSong(currentUser(req).id, input)));
}));

songsRouter.get('/:id', handler(async (req, res) => {
  res.json(toSongDto(await songFor(currentUser(req), 'read', String(req.params.id))));
}));

songsRouter.patch('/:id', handler(async (req, res) => {
  const patch = parseBody(SongPatchSchema, req.body);
  res.json(await updateSong(currentUser(req), String(req.params.id), patch));
}));

songsRouter.delete('/:id', handler(async (req, res) => {
  await deleteSong(currentUser(req), String(req.params.id));
  res.status(204).end();
}));
