// Songs: listing, creating, changing and deleting them (with their recordings' files), and their API form.
import { Song } from '@/server/models';
import type { Me, Song as SongDto, SongInput, SongPatch } from '@/shared/schemas';
import { assertMay, missing, type Action } from './access';
import { removeStoredFiles, storageKeysOfSong } from './recordings';

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

/** The song, when `user` may do `action` to it (see access.ts); otherwise "song not found". */
export async function songFor(user: Me, action: Action, songId: string): Promise<Song> {
  const song = await Song.findByPk(songId);
  if (!song) throw missing('song');
  await assertMay(user, action, 'song', song.ownerId);
  return song;
}

/** The library: a player's own songs. */
export async function listSongs(user: Me): Promise<SongDto[]> {
  return (await Song.findAll({ where: { ownerId: user.id }, order: [['updatedAt', 'DESC']] })).map(toSongDto);
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

export async function updateSong(user: Me, songId: string, patch: SongPatch): Promise<SongDto> {
  const song = await songFor(user, 'write', songId);
  return toSongDto(await song.update(patch as Partial<Song>));
}

/** The song's rows go first (its recordings, candidates and log cascade), then its recordings' files. */
export async function deleteSong(user: Me, songId: string): Promise<void> {
  const song = await songFor(user, 'write', songId);
  const keys = await storageKeysOfSong(song.id);
  await song.destroy();
  await removeStoredFiles(keys);
}
