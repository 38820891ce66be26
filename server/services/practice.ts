// A song's practice log: entries by hand or from step-up runs, on the whole piece, a saved passage or a loop
// of a recording, and what a clean session does to the working tempo.
import { PracticeEntry, Recording } from '@/server/models';
import { HttpError } from '@/server/http';
import type { Me, PracticeEntryDto, PracticeInput } from '@/shared/schemas';
import { assertMay } from './access';
import { passageFor } from './passages';
import { songFor } from './songs';
import { setByColumns } from './users';

export const toPracticeDto = (p: PracticeEntry): PracticeEntryDto => ({
  id: p.id,
  songId: p.songId,
  passage: p.passage,
  passageId: p.passageId,
  recordingId: p.recordingId,
  startSec: p.startSec,
  endSec: p.endSec,
  startBar: p.startBar,
  endBar: p.endBar,
  startBpm: p.startBpm,
  reachedBpm: p.reachedBpm,
  repetitions: p.repetitions,
  minutes: p.minutes,
  clean: Boolean(p.clean),
  createdAt: p.createdAt.toISOString(),
});

/** The latest 500 entries, newest first. */
export async function listPractice(user: Me, songId: string): Promise<PracticeEntryDto[]> {
  const song = await songFor(user, 'read', songId);
  await assertMay(user, 'read', 'practice-entry', song.ownerId);
  return (await PracticeEntry.findAll({ where: { songId: song.id }, order: [['createdAt', 'DESC']], limit: 500 })).map(
    toPracticeDto,
  );
}

/** Where the entry was played: a saved passage (its region copied), a loop of a recording, or the whole piece. */
async function whereItWasPlayed(user: Me, songId: string, input: PracticeInput) {
  if (input.passageId) {
    const passage = await passageFor(user, 'read', input.passageId).catch(() => null);
    if (!passage || passage.songId !== songId)
      throw new HttpError(400, 'invalid_body', 'passageId: choose a passage of this song', 'passageId');
    const { recordingId, startSec, endSec, startBar, endBar } = passage;
    return {
      passage,
      label: input.passage ?? passage.name,
      region: { passageId: passage.id, recordingId, startSec, endSec, startBar, endBar },
    };
  }
  const none = { passageId: null, recordingId: null, startSec: null, endSec: null, startBar: null, endBar: null };
  if (!input.recordingId) return { passage: null, label: input.passage ?? null, region: none };
  const recording = await Recording.findByPk(input.recordingId, { attributes: ['songId'] });
  if (!recording || recording.songId !== songId)
    throw new HttpError(400, 'invalid_body', 'recordingId: choose a recording of this song', 'recordingId');
  if (
    (input.startSec == null) !== (input.endSec == null) ||
    (input.startSec != null && input.endSec! <= input.startSec)
  ) {
    throw new HttpError(
      400,
      'invalid_body',
      'endSec: give where the loop starts and ends, the end after the start',
      'endSec',
    );
  }
  const region = {
    ...none,
    recordingId: input.recordingId,
    startSec: input.startSec ?? null,
    endSec: input.endSec ?? null,
    startBar: input.startBar ?? null,
    endBar: input.endBar ?? null,
  };
  return { passage: null, label: input.passage ?? null, region };
}

/**
 * Logging a clean session at a faster tempo moves the working tempo up to it: the saved passage's when it was
 * played on one, the song's when the whole piece was played.
 */
export async function logPractice(user: Me, songId: string, input: PracticeInput): Promise<PracticeEntryDto> {
  const song = await songFor(user, 'write', songId);
  await assertMay(user, 'write', 'practice-entry', song.ownerId);
  const where = await whereItWasPlayed(user, song.id, input);
  const entry = await PracticeEntry.create({
    songId: song.id,
    userId: user.id,
    passage: where.label,
    ...where.region,
    startBpm: input.startBpm,
    reachedBpm: input.reachedBpm,
    repetitions: input.repetitions,
    minutes: input.minutes,
    clean: input.clean,
  });
  if (input.clean) {
    const wholePiece = !where.passage && !where.region.recordingId && !where.label;
    const faster = (working: number | null) => working === null || input.reachedBpm > working;
    const raised = { workingBpm: input.reachedBpm, ...setByColumns(user.id, { workingBpm: input.reachedBpm }) };
    if (where.passage && faster(where.passage.workingBpm)) await where.passage.update(raised);
    if (wholePiece && faster(song.workingBpm)) await song.update(raised);
  }
  return toPracticeDto(entry);
}
