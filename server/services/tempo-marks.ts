// Intended tempo changes: stretches of a recording its owner marks as rubato or ritardando, which the
// steadiness report leaves out of its figures. The owner writes them; whoever may read the recording reads them.
import { Recording, TempoMark } from '@/server/models';
import { HttpError } from '@/server/http';
import type { Me, TempoMark as TempoMarkDto, TempoMarkInput } from '@/shared/schemas';
import { assertMay, missing } from './access';
import { recordingFor } from './recordings';

const toDto = (m: TempoMark): TempoMarkDto => ({
  id: m.id,
  recordingId: m.recordingId,
  kind: m.kind,
  startSec: m.startSec,
  endSec: m.endSec,
  createdAt: m.createdAt.toISOString(),
});

export async function listTempoMarks(user: Me, recordingId: string): Promise<TempoMarkDto[]> {
  const r = await recordingFor(user, 'read', recordingId);
  await assertMay(user, 'read', 'tempo-mark', r.ownerId);
  return (await TempoMark.findAll({ where: { recordingId: r.id }, order: [['startSec', 'ASC']] })).map(toDto);
}

export async function addTempoMark(user: Me, recordingId: string, input: TempoMarkInput): Promise<TempoMarkDto> {
  const r = await recordingFor(user, 'read', recordingId);
  await assertMay(user, 'write', 'tempo-mark', r.ownerId);
  // A little past the decoded length is allowed: the last bar line can fall a few milliseconds after it.
  if (input.endSec > r.durationSec + 0.5)
    throw new HttpError(400, 'invalid_body', 'endSec: the marked passage must end within the recording', 'endSec');
  return toDto(await TempoMark.create({ recordingId: r.id, ...input }));
}

export async function deleteTempoMark(user: Me, id: string): Promise<void> {
  const m = await TempoMark.findByPk(id);
  if (!m) throw missing('tempo-mark');
  const r = await Recording.findByPk(m.recordingId, { attributes: ['ownerId'] });
  await assertMay(user, 'write', 'tempo-mark', r?.ownerId);
  await m.destroy();
}
