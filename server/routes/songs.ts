import { Router } from 'express';
import { handler, parseBody } from '@/server/http';
import { currentUser, requireUser } from '@/server/middleware/session';
import { SongInputSchema, SongPatchSchema } from '@/shared/schemas';
import { createSong, listSongs, songForOwner, songForReader, toSongDto, updateSong } from '@/server/services/songs';
import { deleteSong } from '@/server/services/recordings';

export const songsRouter = Router();
songsRouter.use(requireUser);

songsRouter.get('/', handler(async (req, res) => {
  res.json({ songs: (await listSongs(currentUser(req).id)).map(toSongDto) });
}));

songsRouter.post('/', handler(async (req, res) => {
  const input = parseBody(SongInputSchema, req.body);
  res.status(201).json(toSongDto(await createSong(currentUser(req).id, input)));
}));

songsRouter.get('/:id', handler(async (req, res) => {
  res.json(toSongDto(await songForReader(currentUser(req), String(req.params.id))));
}));

songsRouter.patch('/:id', handler(async (req, res) => {
  const patch = parseBody(SongPatchSchema, req.body);
  const song = await songForOwner(currentUser(req), String(req.params.id));
  res.json(toSongDto(await updateSong(song, patch)));
}));

songsRouter.delete('/:id', handler(async (req, res) => {
  const song = await songForOwner(currentUser(req), String(req.params.id));
  // Its recordings' rows go with it (cascade), and their stored files too.
  await deleteSong(song);
  res.status(204).end();
}));
