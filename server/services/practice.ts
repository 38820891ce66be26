// A song's practice log: entries by hand or from step-up runs, and what a clean session does to the working tempo.
import { PracticeEntry } from '@/server/models';
import type { Me, PracticeEntryDto, PracticeInput } from '@/shared/schemas';
import { assertMay } from './access';
import { songFor } from './songs';

export const toPracticeDto = (p: PracticeEntry): PracticeEntryDto => ({
  id: p.id,
  songId: p.songId,
  passage: p.passage,
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
  return (await PracticeEntry.findAll({ where: { songId: song.id }, order: [['createdAt', 'DESC']], limit: 500 })).map(toPracticeDto);
}

/** Logging a clean session at a faster tempo moves the song's working tempo up to it. */
export async function logPractice(user: Me, songId: string, input: PracticeInput): Promise<PracticeEntryDto> {
  const song = await songFor(user, 'write', songId);
  await assertMay(user, 'write', 'practice-entry', song.ownerId);
  const entry = await PracticeEntry.create({ ...input, songId: song.id, userId: user.id, passage: input.passage ?? null });
  if (input.clean && !input.passage && (song.workingBpm === null || input.reachedBpm > song.workingBpm)) await song.update({ workingBpm: input.reachedBpm });
  return toPracticeDto(entry);
}
