// Songs: listing, creating, changing and deleting them (with their recordings' files), the working and goal
// tempos (which a linked teacher may set too), and their API form with what the person asking may do.
import { Song } from '@/server/models';
import type { Me, Song as SongDto, SongInput, SongPatch, SongTempos } from '@/shared/schemas';
import { allows, assertMay, missing, relationTo, type Action } from './access';
import { removeStoredFiles, storageKeysOfSong } from './recordings';
import { namesOf, setByColumns, setByView } from './users';

/** Songs as `user` sees them: with who set their tempos and what `user` may do with each. */
export async function songViews(user: Me, songs: Song[]): Promise<SongDto[]> {
  const names = await namesOf(
    songs.flatMap((s) => [s.ownerId, s.workingSetBy, s.goalSetBy]),
    user,
  );
  const relations = new Map<string, Awaited<ReturnType<typeof relationTo>>>();
  for (const ownerId of new Set(songs.map((s) => s.ownerId))) relations.set(ownerId, await relationTo(user, ownerId));
  return songs.map((song) => {
    const relation = relations.get(song.ownerId)!;
    return {
      id: song.id,
      ownerId: song.ownerId,
      ownerName: names.get(song.ownerId) ?? '',
      title: song.title,
      composer: song.composer,
      meter: song.meter,
      goalBpm: song.goalBpm,
      workingBpm: song.workingBpm,
      chosenBpm: song.chosenBpm,
      notes: song.notes,
      chosenNote: song.chosenNote ?? null,
      ...setByView(song, names),
      permissions: {
        edit: allows(relation, 'write', 'song'),
        setTempos: allows(relation, 'write', 'song-tempos'),
        addReference: allows(relation, 'write', 'reference'),
        addTake: allows(relation, 'write', 'take'),
      },
      createdAt: song.createdAt.toISOString(),
      updatedAt: song.updatedAt.toISOString(),
    };
  });
}

export const songView = async (user: Me, song: Song) => (await songViews(user, [song]))[0]!;

/** The song, when `user` may do `action` to it (see access.ts); otherwise "song not found". */
export async function songFor(user: Me, action: Action, songId: string): Promise<Song> {
  const song = await Song.findByPk(songId);
  if (!song) throw missing('song');
  await assertMay(user, action, 'song', song.ownerId);
  return song;
}

export async function getSong(user: Me, songId: string): Promise<SongDto> {
  return songView(user, await songFor(user, 'read', songId));
}

/** The library: a player's own songs. */
export async function listSongs(user: Me): Promise<SongDto[]> {
  return songViews(user, await Song.findAll({ where: { ownerId: user.id }, order: [['updatedAt', 'DESC']] }));
}

export async function createSong(owner: Me, input: SongInput): Promise<SongDto> {
  const song = await Song.create({
    ownerId: owner.id,
    title: input.title,
    composer: input.composer ?? null,
    meter: input.meter ?? '4/4',
    goalBpm: input.goalBpm ?? null,
    workingBpm: input.workingBpm ?? null,
    chosenBpm: input.chosenBpm ?? null,
    notes: input.notes ?? null,
    ...setByColumns(owner.id, { workingBpm: input.workingBpm ?? undefined, goalBpm: input.goalBpm ?? undefined }),
  });
  return songView(owner, song);
}

export async function updateSong(user: Me, songId: string, patch: SongPatch): Promise<SongDto> {
  const song = await songFor(user, 'write', songId);
  return songView(user, await song.update({ ...(patch as Partial<Song>), ...setByColumns(user.id, patch) }));
}

/** Working and goal tempo, by the player or their linked teacher; the song records who set them and when. */
export async function setSongTempos(user: Me, songId: string, tempos: SongTempos): Promise<SongDto> {
  const song = await Song.findByPk(songId);
  if (!song) throw missing('song');
  await assertMay(user, 'read', 'song', song.ownerId);
  await assertMay(user, 'write', 'song-tempos', song.ownerId);
  return songView(user, await song.update({ ...tempos, ...setByColumns(user.id, tempos) }));
}

/** The song's rows go first (its recordings, candidates and log cascade), then its recordings' files. */
export async function deleteSong(user: Me, songId: string): Promise<void> {
  const song = await songFor(user, 'write', songId);
  const keys = await storageKeysOfSong(song.id);
  await song.destroy();
  await removeStoredFiles(keys);
}
