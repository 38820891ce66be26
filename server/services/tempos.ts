// A song's candidate tempos and its chosen tempo.
import { CandidateTempo, Song } from '@/server/models';
import type { Candidate, CandidateInput, CandidatePatch, Me, Song as SongDto } from '@/shared/schemas';
import { assertMay, missing, type Action } from './access';
import { songFor, songView } from './songs';

export const toCandidateDto = (c: CandidateTempo): Candidate => ({
  id: c.id,
  songId: c.songId,
  bpm: c.bpm,
  rating: c.rating,
  note: c.note,
  createdAt: c.createdAt.toISOString(),
});

export async function listCandidates(user: Me, songId: string): Promise<Candidate[]> {
  const song = await songFor(user, 'read', songId);
  return (await CandidateTempo.findAll({ where: { songId: song.id }, order: [['bpm', 'ASC']] })).map(toCandidateDto);
}

export async function addCandidate(user: Me, songId: string, input: CandidateInput): Promise<Candidate> {
  const song = await songFor(user, 'write', songId);
  return toCandidateDto(
    await CandidateTempo.create({
      songId: song.id,
      bpm: input.bpm,
      rating: input.rating ?? null,
      note: input.note ?? null,
    }),
  );
}

/** The candidate, when `user` may do `action` to it: candidates belong to their song's owner. */
async function candidateFor(user: Me, action: Action, id: string): Promise<CandidateTempo> {
  const c = await CandidateTempo.findByPk(id);
  if (!c) throw missing('candidate');
  const song = await Song.findByPk(c.songId, { attributes: ['ownerId'] });
  await assertMay(user, action, 'candidate', song?.ownerId);
  return c;
}

export async function updateCandidate(user: Me, id: string, patch: CandidatePatch): Promise<Candidate> {
  const c = await candidateFor(user, 'write', id);
  return toCandidateDto(await c.update(patch as Partial<CandidateTempo>));
}

export async function deleteCandidate(user: Me, id: string): Promise<void> {
  await (await candidateFor(user, 'write', id)).destroy();
}

/** The chosen tempo and why; choosing also keeps it among the candidates. */
export async function chooseTempo(user: Me, songId: string, bpm: number, note: string | null): Promise<SongDto> {
  const song = await songFor(user, 'write', songId);
  if (!(await CandidateTempo.findOne({ where: { songId: song.id, bpm } })))
    await CandidateTempo.create({ songId: song.id, bpm, rating: null, note: null });
  return songView(user, await song.update({ chosenBpm: bpm, chosenNote: note }));
}
