// Set lists: a player's songs in playing order with each song's click tempo (its chosen tempo, or the analysed
// one marked as not chosen) and how long it lasts at that tempo, and the whole set's length (an estimate where
// a song is counted at its analysed tempo).
import { Analysis, Recording, SetList, SetListItem, Song } from '@/server/models';
import { sequelize } from '@/server/db';
import { HttpError } from '@/server/http';
import { secondsFor } from '@/audio/practice/duration';
import { feltBeatCount, LEVEL_FACTOR, type BeatLevel } from '@/audio/practice/beat-grid';
import type { Me, SetListDto, SetListInput, SetListPatch } from '@/shared/schemas';
import { assertMay, missing, type Action } from './access';
import { readStoredAnalysis } from './recordings';

/** What a song's most recent analysed recording measured, as the player hears it. */
interface Measured {
  /** Beats at the player's beat level (half as many felt in half, twice as many in double). */
  beats: number;
  /** Its tempo at that level: the player's correction, else the engine's. */
  bpm: number;
}

/** Each song's most recent analysed recording, measured. */
async function measured(songIds: string[]): Promise<Map<string, Measured>> {
  if (!songIds.length) return new Map();
  const recordings = await Recording.findAll({
    where: { songId: songIds, status: 'done' },
    attributes: ['id', 'songId', 'correctedBpm', 'beatLevel'],
    order: [['createdAt', 'DESC']],
  });
  const analyses = new Map(
    (await Analysis.findAll({ where: { recordingId: recordings.map((r) => r.id) } })).map((a) => [a.recordingId, a]),
  );
  const out = new Map<string, Measured>();
  for (const r of recordings) {
    if (out.has(r.songId)) continue;
    const a = readStoredAnalysis(analyses.get(r.id) ?? null);
    const found = r.correctedBpm ?? a?.bpm;
    if (!a || a.beatCount <= 0 || !found) continue;
    const level = r.beatLevel as BeatLevel;
    out.set(r.songId, {
      beats: feltBeatCount(a.beatCount, a.bpm, r.correctedBpm, level),
      bpm: found * LEVEL_FACTOR[level],
    });
  }
  return out;
}

/** Set lists in their API form: the items, songs and measured beats of all of them in three queries, not per list. */
async function toSetListDtos(lists: SetList[]): Promise<SetListDto[]> {
  if (!lists.length) return [];
  const items = await SetListItem.findAll({
    where: { setListId: lists.map((l) => l.id) },
    order: [['position', 'ASC']],
  });
  const songIds = [...new Set(items.map((i) => i.songId))];
  const songs = new Map((await Song.findAll({ where: { id: songIds } })).map((s) => [s.id, s]));
  const measures = await measured(songIds);
  return lists.map((list) => {
    const rows = items
      .filter((i) => i.setListId === list.id)
      .map((i) => songs.get(i.songId))
      .filter((s): s is Song => Boolean(s))
      .map((s) => {
        const m = measures.get(s.id);
        // At the chosen tempo when there is one; else the recording's own tempo gives its length as recorded.
        const at = m ? (s.chosenBpm ? 'chosen' : 'analysed') : null;
        return {
          songId: s.id,
          title: s.title,
          meter: s.meter,
          chosenBpm: s.chosenBpm,
          analysedBpm: m?.bpm ?? null,
          durationSec: m ? secondsFor(m.beats, s.chosenBpm ?? m.bpm) : null,
          durationAt: at,
        } as const;
      });
    const known = rows.filter((r) => r.durationSec !== null);
    return {
      id: list.id,
      name: list.name,
      songs: rows,
      totalSec: known.reduce((sum, r) => sum + r.durationSec!, 0),
      unknownDurations: rows.length - known.length,
      estimatedDurations: known.filter((r) => r.durationAt === 'analysed').length,
      updatedAt: list.updatedAt.toISOString(),
    };
  });
}

const toSetListDto = async (list: SetList) => (await toSetListDtos([list]))[0]!;

async function setListFor(user: Me, action: Action, id: string): Promise<SetList> {
  const list = await SetList.findByPk(id);
  if (!list) throw missing('set-list');
  await assertMay(user, action, 'set-list', list.ownerId);
  return list;
}

/** The songs must be the owner's own, each once. */
async function checkSongs(ownerId: string, songIds: string[]) {
  if (new Set(songIds).size !== songIds.length)
    throw new HttpError(400, 'invalid_body', 'songIds: each song once', 'songIds');
  const own = await Song.count({ where: { id: songIds, ownerId } });
  if (own !== songIds.length)
    throw new HttpError(400, 'invalid_body', 'songIds: choose songs from your own library', 'songIds');
}

async function writeItems(setListId: string, songIds: string[]) {
  await sequelize.transaction(async (transaction) => {
    await SetListItem.destroy({ where: { setListId }, transaction });
    await SetListItem.bulkCreate(
      songIds.map((songId, position) => ({ setListId, songId, position })),
      { transaction },
    );
  });
}

export async function listSetLists(user: Me): Promise<SetListDto[]> {
  const lists = await SetList.findAll({ where: { ownerId: user.id }, order: [['updatedAt', 'DESC']] });
  return toSetListDtos(lists);
}

export async function getSetList(user: Me, id: string): Promise<SetListDto> {
  return toSetListDto(await setListFor(user, 'read', id));
}

export async function createSetList(user: Me, input: SetListInput): Promise<SetListDto> {
  await checkSongs(user.id, input.songIds);
  const list = await SetList.create({ ownerId: user.id, name: input.name });
  await writeItems(list.id, input.songIds);
  return toSetListDto(list);
}

/** Renames the list and/or puts its songs in a new order (the whole order, as the player arranged it). */
export async function updateSetList(user: Me, id: string, patch: SetListPatch): Promise<SetListDto> {
  const list = await setListFor(user, 'write', id);
  if (patch.songIds) {
    await checkSongs(list.ownerId, patch.songIds);
    await writeItems(list.id, patch.songIds);
  }
  list.changed('updatedAt', true);
  await list.update({ name: patch.name ?? list.name });
  return toSetListDto(list);
}

export async function deleteSetList(user: Me, id: string): Promise<void> {
  await (await setListFor(user, 'write', id)).destroy();
}
