// Recordings: storing an upload with its row and analysis job, reading them back (the analysis validated
// against its one schema), serving their audio, changing and deleting them with their files.
import crypto from 'node:crypto';
import fs from 'node:fs';
import type { Readable } from 'node:stream';
import { sequelize } from '@/server/db';
import { config } from '@/server/config';
import { Analysis, Recording, Song } from '@/server/models';
import { HttpError } from '@/server/http';
import { objectStore, type ByteRange } from '@/server/storage';
import { enqueue, retry } from '@/server/jobs/queue';
import { analysisRunner } from '@/server/jobs/runner';
import type { CheckedAudio } from '@/server/analysis/audio-check';
import { checkPool } from '@/server/analysis/check-pool';
import {
  AnalysisSchema,
  type Analysis as AnalysisDto,
  type Me,
  type Recording as RecordingDto,
  type RecordingKind,
  type RecordingPatch,
} from '@/shared/schemas';
import { allows, assertMay, may, missing, relationTo, type Action } from './access';
import { namesOf, personRef } from './users';

/**
 * The uploaded file name, kept only to show it back. Browsers send a bare name; one with folders or control
 * characters is refused rather than guessed at (it is never used to store the file either way).
 */
export function checkFileName(name: string | undefined): string | null {
  if (!name) return null;
  if (/[\u0000-\u001f\u007f]/.test(name))
    throw new HttpError(400, 'invalid_body', 'file: the file name contains control characters', 'file');
  // Direction controls can make a name display as something else (Unicode TR #36, "bidi spoofing").
  if (/[\u061c\u200e\u200f\u202a-\u202e\u2066-\u2069]/.test(name)) {
    throw new HttpError(400, 'invalid_body', 'file: the file name contains text-direction control characters', 'file');
  }
  if (/[\\/]/.test(name) || name.split(/[\\/]/).includes('..'))
    throw new HttpError(400, 'invalid_body', 'file: send the file name without folders', 'file');
  return name.trim().slice(0, 255) || null;
}

export async function storeRecording(opts: {
  songId: string;
  ownerId: string;
  /** Who uploaded it when not the owner (a teacher's reference). */
  uploadedBy: string | null;
  kind: RecordingKind;
  label: string | null;
  originalName: string | null;
  spoolFile: string;
  /** The spool file is the upload's own and may be moved into the store (not the seed's demo files). */
  moveSpoolFile?: boolean;
  sizeBytes: number;
  audio: CheckedAudio;
}): Promise<Recording> {
  // The stored name is a generated id, never the uploaded name. File first, rows second: if the rows cannot
  // be written the file is removed again, so neither is ever left without the other.
  const storageKey = crypto.randomUUID();
  if (opts.moveSpoolFile) await objectStore().adopt(storageKey, opts.spoolFile, opts.audio.mimeType);
  else await objectStore().put(storageKey, fs.createReadStream(opts.spoolFile), opts.audio.mimeType);
  try {
    return await sequelize.transaction(async (t) => {
      const recording = await Recording.create(
        {
          songId: opts.songId,
          ownerId: opts.ownerId,
          uploadedBy: opts.uploadedBy,
          kind: opts.kind,
          label: opts.label,
          originalName: opts.originalName,
          storageKey,
          format: opts.audio.format,
          mimeType: opts.audio.mimeType,
          sizeBytes: opts.sizeBytes,
          durationSec: opts.audio.durationSec,
        },
        { transaction: t },
      );
      await enqueue(recording.id, t);
      return recording;
    });
  } catch (err) {
    await objectStore()
      .remove(storageKey)
      .catch(() => {});
    throw err;
  }
}

/**
 * Whether `user` may add a recording to the song at all (a take: its owner; a reference: also their linked
 * teacher). Asked before a byte of an upload is accepted.
 */
export async function assertMayUploadTo(user: Me, songId: string): Promise<Song> {
  const song = await Song.findByPk(songId);
  if (!song) throw missing('song');
  await assertMay(user, 'read', 'song', song.ownerId);
  await assertMay(user, 'write', 'reference', song.ownerId);
  return song;
}

/**
 * An upload that multer has spooled: judged by its content, stored, and queued for analysis. It belongs to
 * the song's owner; a teacher's reference records the teacher as its uploader.
 */
export async function addRecording(
  user: Me,
  songId: string,
  upload: {
    kind: RecordingKind;
    label: string | null;
    fileName: string | undefined;
    spoolFile: string;
    sizeBytes: number;
  },
): Promise<RecordingDto> {
  const song = await assertMayUploadTo(user, songId);
  if (upload.kind === 'take' && !(await may(user, 'write', 'take', song.ownerId))) {
    throw new HttpError(403, 'forbidden', 'kind: a take is the player’s own; add this as a reference', 'kind');
  }
  const originalName = checkFileName(upload.fileName);
  const audio = await checkPool().check(upload.spoolFile, config.uploads.maxDurationSec);
  const uploadedBy = user.id === song.ownerId ? null : user.id;
  const recording = await storeRecording({
    songId: song.id,
    ownerId: song.ownerId,
    uploadedBy,
    kind: upload.kind,
    label: upload.label,
    originalName,
    spoolFile: upload.spoolFile,
    moveSpoolFile: true,
    sizeBytes: upload.sizeBytes,
    audio,
  });
  analysisRunner()?.poke();
  return toRecordingDto(user, recording, null);
}

/** The recording, when `user` may do `action` to it (see access.ts); otherwise "recording not found". */
export async function recordingFor(user: Me, action: Action, id: string): Promise<Recording> {
  const r = await Recording.findByPk(id);
  if (!r) throw missing('recording');
  await assertMay(user, action, 'recording', r.ownerId);
  return r;
}

/**
 * A recording named in a request about a song (a passage's region, a practice entry's loop) must be one of
 * that song's: anything else is the caller's mistake (400), not a missing resource. The song's own access
 * check has already run, so this reveals nothing another person could not see.
 */
export async function recordingOfSong(songId: string, recordingId: string): Promise<Recording> {
  const recording = await Recording.findByPk(recordingId, { attributes: ['id', 'songId', 'durationSec'] });
  if (!recording || recording.songId !== songId)
    throw new HttpError(400, 'invalid_body', 'recordingId: choose a recording of this song', 'recordingId');
  return recording;
}

/**
 * A stored analysis, checked against the one schema as it is read. A result that no longer fits (written by
 * an engine whose output differed) is shown as no analysis rather than passed on half-understood; the
 * re-analysis of outdated results replaces it.
 */
export function readStoredAnalysis(a: Analysis | null): AnalysisDto | null {
  if (!a) return null;
  const parsed = AnalysisSchema.safeParse(JSON.parse(a.result));
  if (parsed.success) return parsed.data;
  console.error(
    `[tactus] the stored analysis of recording ${a.recordingId} does not fit the schema: ${parsed.error.issues[0]?.message}`,
  );
  return null;
}

/** The recording as `user` sees it: its analysis (checked), who uploaded it, and what `user` may do with it. */
export async function toRecordingDto(user: Me, r: Recording, analysis?: Analysis | null): Promise<RecordingDto> {
  const result = readStoredAnalysis(analysis === undefined ? await Analysis.findByPk(r.id) : analysis);
  const relation = await relationTo(user, r.ownerId);
  const names = await namesOf([r.uploadedBy, r.ownerId], user);
  return {
    id: r.id,
    songId: r.songId,
    ownerId: r.ownerId,
    ownerName: names.get(r.ownerId) ?? '',
    kind: r.kind,
    label: r.label,
    originalName: r.originalName,
    format: r.format,
    sizeBytes: r.sizeBytes,
    durationSec: r.durationSec,
    status: r.status,
    progress: r.progress,
    error: r.error,
    originalBpm: r.correctedBpm ?? result?.bpm ?? null,
    correctedBpm: r.correctedBpm,
    beatOffsetSec: r.beatOffsetSec,
    beatLevel: r.beatLevel,
    barOneSec: r.barOneSec,
    nudgeMs: r.nudgeMs,
    uploadedBy: personRef(r.uploadedBy, names),
    permissions: { edit: allows(relation, 'write', 'recording'), note: allows(relation, 'write', 'note') },
    analysis: result,
    createdAt: r.createdAt.toISOString(),
  };
}

export async function getRecording(user: Me, id: string): Promise<RecordingDto> {
  return toRecordingDto(user, await recordingFor(user, 'read', id));
}

/** A song's recordings, newest first, with all their analyses read in one query rather than one each. */
export async function listRecordings(user: Me, song: Song): Promise<RecordingDto[]> {
  await assertMay(user, 'read', 'recording', song.ownerId);
  const rows = await Recording.findAll({ where: { songId: song.id }, order: [['createdAt', 'DESC']] });
  const analyses = new Map(
    (await Analysis.findAll({ where: { recordingId: rows.map((r) => r.id) } })).map((a) => [a.recordingId, a]),
  );
  return Promise.all(rows.map((r) => toRecordingDto(user, r, analyses.get(r.id) ?? null)));
}

/** The waveform peaks as stored (JSON text), once the analysis has made them. */
export async function recordingPeaks(user: Me, id: string): Promise<string> {
  const r = await recordingFor(user, 'read', id);
  const a = await Analysis.findByPk(r.id, { attributes: ['peaks'] });
  if (!a) throw new HttpError(409, 'not_ready', `the waveform is not ready yet (analysis ${r.status})`);
  return a.peaks;
}

/** The stored file (or one byte range of it) with what the answer needs to describe it. */
export async function recordingAudio(
  user: Me,
  id: string,
): Promise<{ sizeBytes: number; mimeType: string; open: (range?: ByteRange) => Promise<Readable> }> {
  const r = await recordingFor(user, 'read', id);
  return { sizeBytes: r.sizeBytes, mimeType: r.mimeType, open: (range) => objectStore().read(r.storageKey, range) };
}

export async function patchRecording(user: Me, id: string, patch: RecordingPatch): Promise<RecordingDto> {
  const r = await recordingFor(user, 'write', id);
  if (patch.beatOffsetSec != null && patch.beatOffsetSec > r.durationSec) {
    throw new HttpError(400, 'invalid_body', 'beatOffsetSec: must lie within the recording', 'beatOffsetSec');
  }
  if (patch.barOneSec != null && patch.barOneSec > r.durationSec) {
    throw new HttpError(400, 'invalid_body', 'barOneSec: must lie within the recording', 'barOneSec');
  }
  return toRecordingDto(user, await r.update(patch as Partial<Recording>));
}

/** A failed analysis goes back in the queue. */
export async function retryRecording(user: Me, id: string): Promise<RecordingDto> {
  const r = await recordingFor(user, 'write', id);
  if (!(await retry(r.id))) throw new HttpError(409, 'not_failed', 'only a failed analysis can be retried');
  analysisRunner()?.poke();
  return toRecordingDto(user, await r.reload());
}

/** Rows first (one transaction), then the file: a failed delete leaves everything in place. */
export async function deleteRecording(user: Me, id: string): Promise<void> {
  const r = await recordingFor(user, 'write', id);
  await sequelize.transaction(async (t) => {
    await Recording.destroy({ where: { id: r.id }, transaction: t });
  });
  await removeStoredFiles([r.storageKey]);
}

export async function storageKeysOfSong(songId: string): Promise<string[]> {
  return (await Recording.findAll({ where: { songId }, attributes: ['storageKey'] })).map((r) => r.storageKey);
}

/** Removes stored files whose rows are gone; a file that cannot be removed is reported, not fatal. */
export async function removeStoredFiles(keys: string[]): Promise<void> {
  for (const key of keys)
    await objectStore()
      .remove(key)
      .catch((err) => console.error('[tactus] could not remove a stored file:', err));
}
