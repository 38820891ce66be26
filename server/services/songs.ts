// Songs: listing, creating, changing and deleting them (with their recordings' files), the working and goal
// tempos (which a linked teacher may set too), and their API form with what the person asking may do.
import { literal, Op, type Order, type WhereOptions } from 'sequelize';
import { Song } from '@/server/models';
import type {
  SongListItem,
  LibrarySort,
  Me,
  Song as SongDto,
  SongInput,
  SongListQuery,
  SongPatch,
  SongTempos,
} from '@/shared/schemas';
import { allows, assertMay, missing, relationTo, type Action } from './access';
import { removeStoredFiles, storageKeysOfSong } from './recordings';
import { namesOf, setByColumns, setByView, tempoColumns } from './users';

/** What a song's API form is made of. */
type SongFields = Pick<
  Song,
  | 'id'
  | 'ownerId'
  | 'title'
  | 'composer'
  | 'key'
  | 'meter'
  | 'goalBpm'
  | 'workingBpm'
  | 'chosenBpm'
  | 'notes'
  | 'chosenNote'
  | 'workingSetBy'
  | 'workingSetAt'
  | 'goalSetBy'
  | 'goalSetAt'
  | 'createdAt'
  | 'updatedAt'
>;

/** Songs as `user` sees them: with who set their tempos and what `user` may do with each. */
export async function songViews(user: Me, songs: SongFields[]): Promise<SongDto[]> {
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
      key: song.key ?? null,
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

// The library's figures, worked out by the database in the one query that lists the songs (correlated
// subqueries on indexed songId columns), so a long library costs one round trip, not one per song.
const LAST_PRACTISED = '(SELECT MAX(p.`createdAt`) FROM `practice_entries` p WHERE p.`songId` = `Song`.`id`)';
const RECORDINGS = '(SELECT COUNT(*) FROM `recordings` r WHERE r.`songId` = `Song`.`id`)';
const PASSAGES = '(SELECT COUNT(*) FROM `passages` g WHERE g.`songId` = `Song`.`id`)';
/** Working tempo as a share of the goal; NULL unless both are set. */
const PROGRESS = '(`Song`.`workingBpm` / `Song`.`goalBpm`)';
/** "Ready to perform" (see LIBRARY_STATUSES in shared/schemas.ts): the working tempo has reached the goal. */
const READY =
  '(`Song`.`workingBpm` IS NOT NULL AND `Song`.`goalBpm` IS NOT NULL AND `Song`.`workingBpm` >= `Song`.`goalBpm`)';

/** Songs without the value sorted on come last, whatever the direction; ties read by title. */
const ORDERS: Record<LibrarySort, Order> = {
  title: [
    ['title', 'ASC'],
    ['id', 'ASC'],
  ],
  lastPractised: [
    [literal(`${LAST_PRACTISED} IS NULL`), 'ASC'],
    [literal(LAST_PRACTISED), 'DESC'],
    ['title', 'ASC'],
  ],
  chosenBpm: [
    [literal('`Song`.`chosenBpm` IS NULL'), 'ASC'],
    ['chosenBpm', 'ASC'],
    ['title', 'ASC'],
  ],
  progress: [
    [literal(`${PROGRESS} IS NULL`), 'ASC'],
    [literal(PROGRESS), 'DESC'],
    ['title', 'ASC'],
  ],
};

/** `%`, `_` and `\` typed in a search are letters to find, not LIKE's wildcards. */
const likeWord = (word: string) => `%${word.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** The library: a player's own songs whose title or composer/artist holds every word of `q`, sorted, filtered. */
export async function listSongs(user: Me, query: SongListQuery = { sort: 'title' }): Promise<SongListItem[]> {
  const words = (query.q ?? '').split(/\s+/).filter(Boolean);
  const where: WhereOptions[] = [{ ownerId: user.id }];
  for (const word of words)
    where.push({ [Op.or]: [{ title: { [Op.like]: likeWord(word) } }, { composer: { [Op.like]: likeWord(word) } }] });
  if (query.status) where.push(literal(query.status === 'ready' ? READY : `NOT ${READY}`));
  // Plain rows (raw) of only the columns the library shows: a model instance per song, and the whole song's
  // view (names of who set the tempos, permissions, notes), cost more than the query itself in a long library.
  // Only the player's own songs are listed, so no other person's access needs checking here.
  const rows = (await Song.findAll({
    attributes: [
      ...LIST_COLUMNS,
      [literal(LAST_PRACTISED), 'lastPractisedAt'],
      [literal(RECORDINGS), 'recordingCount'],
      [literal(PASSAGES), 'passageCount'],
      [literal(PROGRESS), 'progress'],
      [literal(READY), 'ready'],
    ],
    where: { [Op.and]: where },
    order: ORDERS[query.sort],
    raw: true,
  })) as unknown as ListRow[];
  return rows.map((row) => ({
    id: row.id,
    title: row.title,
    composer: row.composer,
    key: row.key,
    meter: row.meter,
    goalBpm: numberOrNull(row.goalBpm),
    workingBpm: numberOrNull(row.workingBpm),
    chosenBpm: numberOrNull(row.chosenBpm),
    lastPractisedAt: row.lastPractisedAt === null ? null : new Date(row.lastPractisedAt).toISOString(),
    recordingCount: Number(row.recordingCount),
    passageCount: Number(row.passageCount),
    progress: numberOrNull(row.progress),
    ready: Boolean(Number(row.ready)),
  }));
}

const LIST_COLUMNS = ['id', 'title', 'composer', 'key', 'meter', 'goalBpm', 'workingBpm', 'chosenBpm'] as const;

/** A raw row of the library's query: the driver's own types (DECIMAL tempos as strings, counts as bigints). */
interface ListRow {
  id: string;
  title: string;
  composer: string | null;
  key: string | null;
  meter: string;
  goalBpm: string | number | null;
  workingBpm: string | number | null;
  chosenBpm: string | number | null;
  lastPractisedAt: Date | string | null;
  recordingCount: bigint | number | string;
  passageCount: bigint | number | string;
  progress: string | number | null;
  ready: bigint | number | string;
}

/** Tempos and shares as numbers, as a Song's getters give them (see models/decimal.ts). */
const numberOrNull = (x: string | number | null) => (x === null ? null : Number(x));

export async function createSong(owner: Me, input: SongInput): Promise<SongDto> {
  const song = await Song.create({
    ownerId: owner.id,
    title: input.title,
    composer: input.composer ?? null,
    key: input.key ?? null,
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
  const tempos = tempoColumns(song, user.id, { workingBpm: patch.workingBpm, goalBpm: patch.goalBpm });
  return songView(user, await song.update({ ...(patch as Partial<Song>), ...tempos }));
}

/** Working and goal tempo, by the player or their linked teacher; the song records who set them and when. */
export async function setSongTempos(user: Me, songId: string, tempos: SongTempos): Promise<SongDto> {
  const song = await Song.findByPk(songId);
  if (!song) throw missing('song');
  await assertMay(user, 'read', 'song', song.ownerId);
  await assertMay(user, 'write', 'song-tempos', song.ownerId);
  return songView(user, await song.update(tempoColumns(song, user.id, tempos)));
}

/** The song's rows go first (its recordings, candidates and log cascade), then its recordings' files. */
export async function deleteSong(user: Me, songId: string): Promise<void> {
  const song = await songFor(user, 'write', songId);
  const keys = await storageKeysOfSong(song.id);
  await song.destroy();
  await removeStoredFiles(keys);
}
