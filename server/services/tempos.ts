// A song's candidate tempos, its chosen tempo and its practice log.
import { CandidateTempo, PracticeEntry, type Song } from '@/server/models';
import { notFound } from '@/server/http';
import type { Candidate, Me, PracticeEntryDto, PracticeInput } from '@/shared/schemas';
import { songForOwner } from './songs';

export const toCandidateDto = (c: CandidateTempo): Candidate => ({
  id: c.id,
  songId: c.songId,
  bpm: c.bpm,
  rating: c.rating,
  note: c.note,
  createdAt: c.createdAt.toISOString(),
});

export const listCandidates = (songId: string) => CandidateTempo.findAll({ where: { songId }, order: [['bpm', 'ASC']] });

/** A candidate may only be changed by the owner of its song. */
export async function candidateForOwner(user: Me, id: string): Promise<CandidateTempo> {
  const c = await CandidateTempo.findByPk(id);
  if (!c) throw notFound('candidate tempo');
  await songForOwner(user, c.songId).catch(() => {
    throw notFound('candidate tempo');
  });
  return c;
}

/** The chosen tempo and why; choosing also keeps it among the candidates. */
export async function chooseTempo(song: Song, bpm: number, note: string | null): Promise<Song> {
  if (!(await CandidateTempo.findOne({ where: { songId: song.id, bpm } }))) await CandidateTempo.create({ songId: song.id, bpm, rating: null, note: null });
  return song.update({ chosenBpm: bpm, chosenNote: note });
}

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

export const listPractice = (songId: string) => PracticeEntry.findAll({ where: { songId }, order: [['createdAt', 'DESC']], limit: 500 });

/** Logging a clean session at a faster tempo moves the song's working tempo up to it. */
export async function logPractice(song: Song, userId: string, input: PracticeInput): Promise<PracticeEntry> {
  const entry = await PracticeEntry.create({ ...input, songId: song.id, userId, passage: input.passage ?? null });
  if (input.clean && !input.passage && (song.workingBpm === null || input.reachedBpm > song.workingBpm)) await song.update({ workingBpm: input.reachedBpm });
  return entry;
}
