// Songs: who may read and change them, and their API form.
import { Song, StudioLink } from '@/server/models';
import { notFound } from '@/server/http';
import type { Me, Song as SongDto, SongInput, SongPatch } from '@/shared/schemas';

export function toSongDto(song: Song): SongDto {
  return {
    id: song.id,
    ownerId: song.ownerId,
    title: song.title,
    composer: song.composer,
    meter: song.meter,
    goalBpm: song.goalBpm,
    workingBpm: song.workingBpm,
    chosenBpm: song.chosenBpm,
    notes: song.notes,
    chosenNote: song.chosenNote ?? null,
    createdAt: song.createdAt.toISOString(),
    updatedAt: song.updatedAt.toISOString(),
  };
}

export async function listSongs(ownerId: string): Promise<Song[]> {
  return Song.findAll({ where: { ownerId }, order: [['updatedAt', 'DESC']] });
}

export async function createSong(ownerId: string, input: SongInput): Promise<Song> {
  return Song.create({
    ownerId,
    title: input.title,
    composer: input.composer ?? null,
    meter: input.meter ?? '4/4',
    goalBpm: input.goalBpm ?? null,
    workingBpm: input.workingBpm ?? null,
    chosenBpm: input.chosenBpm ?? null,
    notes: input.notes ?? null,
  });
}

/** The owner, their linked teacher and an admin may read a song; anyone else is told it does not exist. */
export async function songForReader(user: Me, songId: string): Promise<Song> {
  const song = await Song.findByPk(songId);
  if (!song) throw notFound('song');
  if (song.ownerId === user.id || user.role === 'admin') return song;
  if (user.role === 'teacher' && (await StudioLink.count({ where: { teacherId: user.id, studentId: song.ownerId } }))) return song;
  throw notFound('song');
}

/** Only the owner changes a song (teachers set tempos through their own routes, later). */
export async function songForOwner(user: Me, songId: string): Promise<Song> {
  const song = await Song.findByPk(songId);
  if (!song || song.ownerId !== user.id) throw notFound('song');
  return song;
}

export async function updateSong(song: Song, patch: SongPatch): Promise<Song> {
  return song.update(patch as Partial<Song>);
}
