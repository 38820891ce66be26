// Passages: named regions of a song's recordings, each with its own working and goal tempo.
import { Passage, Song } from '@/server/models';
import { HttpError } from '@/server/http';
import type { Me, Passage as PassageDto, PassageInput, PassagePatch, SongTempos } from '@/shared/schemas';
import { assertMay, missing, type Action } from './access';
import { recordingOfSong } from './recordings';
import { songFor } from './songs';
import { namesOf, setByColumns, setByView, tempoColumns } from './users';

/** Passages as the API shows them, with who set their tempos. */
export async function passageViews(passages: Passage[]): Promise<PassageDto[]> {
  const names = await namesOf(passages.flatMap((p) => [p.workingSetBy, p.goalSetBy]));
  return passages.map((p) => toPassageDto(p, names));
}

const toPassageDto = (p: Passage, names: Map<string, string>): PassageDto => ({
  id: p.id,
  songId: p.songId,
  recordingId: p.recordingId,
  name: p.name,
  startSec: p.startSec,
  endSec: p.endSec,
  startBar: p.startBar,
  endBar: p.endBar,
  workingBpm: p.workingBpm,
  goalBpm: p.goalBpm,
  ...setByView(p, names),
  createdAt: p.createdAt.toISOString(),
  updatedAt: p.updatedAt.toISOString(),
});

/** The region must lie in a recording of this song; bars, when given, run forwards. */
async function checkRegion(
  songId: string,
  recordingId: string,
  region: { startSec: number; endSec: number; startBar?: number | null; endBar?: number | null },
) {
  const recording = await recordingOfSong(songId, recordingId);
  if (region.endSec <= region.startSec)
    throw new HttpError(400, 'invalid_body', 'endSec: the passage must end after it starts', 'endSec');
  // A little past the decoded length is allowed: the last bar line can fall a few milliseconds after it.
  if (region.endSec > recording.durationSec + 0.5)
    throw new HttpError(400, 'invalid_body', 'endSec: the passage must end within the recording', 'endSec');
  if (region.startBar != null && region.endBar != null && region.endBar < region.startBar) {
    throw new HttpError(400, 'invalid_body', 'endBar: the last bar comes after the first', 'endBar');
  }
  return recording;
}

export async function listPassages(user: Me, songId: string): Promise<PassageDto[]> {
  const song = await songFor(user, 'read', songId);
  await assertMay(user, 'read', 'passage', song.ownerId);
  return passageViews(
    await Passage.findAll({
      where: { songId: song.id },
      order: [
        ['recordingId', 'ASC'],
        ['startSec', 'ASC'],
      ],
    }),
  );
}

export async function addPassage(user: Me, songId: string, input: PassageInput): Promise<PassageDto> {
  const song = await songFor(user, 'write', songId);
  await assertMay(user, 'write', 'passage', song.ownerId);
  await checkRegion(song.id, input.recordingId, input);
  const p = await Passage.create({
    songId: song.id,
    recordingId: input.recordingId,
    name: input.name,
    startSec: input.startSec,
    endSec: input.endSec,
    startBar: input.startBar ?? null,
    endBar: input.endBar ?? null,
    workingBpm: input.workingBpm ?? null,
    goalBpm: input.goalBpm ?? null,
    ...setByColumns(user.id, { workingBpm: input.workingBpm ?? undefined, goalBpm: input.goalBpm ?? undefined }),
  });
  return (await passageViews([p]))[0]!;
}

/** The passage, when `user` may do `action` to it: passages belong to their song's owner. */
export async function passageFor(user: Me, action: Action, id: string): Promise<Passage> {
  const p = await Passage.findByPk(id);
  if (!p) throw missing('passage');
  const song = await Song.findByPk(p.songId, { attributes: ['ownerId'] });
  await assertMay(user, action, 'passage', song?.ownerId);
  return p;
}

export async function updatePassage(user: Me, id: string, patch: PassagePatch): Promise<PassageDto> {
  const p = await passageFor(user, 'write', id);
  const next = {
    startSec: patch.startSec ?? p.startSec,
    endSec: patch.endSec ?? p.endSec,
    startBar: patch.startBar === undefined ? p.startBar : patch.startBar,
    endBar: patch.endBar === undefined ? p.endBar : patch.endBar,
  };
  await checkRegion(p.songId, p.recordingId, next);
  return (
    await passageViews([await p.update({ ...(patch as Partial<Passage>), ...setByColumns(user.id, patch) })])
  )[0]!;
}

export async function deletePassage(user: Me, id: string): Promise<void> {
  await (await passageFor(user, 'write', id)).destroy();
}

/** A passage's working and goal tempo, by the player or their linked teacher (who set them is kept). */
export async function setPassageTempos(user: Me, id: string, tempos: SongTempos): Promise<PassageDto> {
  const p = await passageFor(user, 'read', id);
  const song = await Song.findByPk(p.songId, { attributes: ['ownerId'] });
  await assertMay(user, 'write', 'song-tempos', song?.ownerId);
  return (await passageViews([await p.update(tempoColumns(p, user.id, tempos))]))[0]!;
}
