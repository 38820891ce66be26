// Recordings: who may read and change them, storing and removing them with their rows, and their API form.
import crypto from 'node:crypto';
import fs from 'node:fs';
import { sequelize } from '@/server/db';
import { Analysis, Recording, Song, StudioLink } from '@/server/models';
import { HttpError, notFound } from '@/server/http';
import { objectStore } from '@/server/storage';
import { enqueue } from '@/server/jobs/queue';
import type { CheckedAudio } from '@/server/analysis/audio-check';
import type { Me, Recording as RecordingDto, RecordingKind, RecordingPatch } from '@/shared/schemas';

/**
 * The uploaded file name, kept only to show it back. Browsers send a bare name; one with folders or control
 * characters is refused rather than guessed at (it is never used to store the file either way).
 */
export function checkFileName(name: string | undefined): string | null {
  if (!name) return null;
  // eslint-disable-next-line no-control-regex
  if (/[\u0000-\u001f\u007f]/.test(name)) throw new HttpError(400, 'invalid_body', 'file: the file name contains control characters', 'file');
  if (/[\\/]/.test(name) || name.split(/[\\/]/).includes('..')) throw new HttpError(400, 'invalid_body', 'file: send the file name without folders', 'file');
  return name.trim().slice(0, 255) || null;
}

export async function storeRecording(opts: {
  song: Song;
  ownerId: string;
  kind: RecordingKind;
  label: string | null;
  originalName: string | null;
  spoolFile: string;
  sizeBytes: number;
  audio: CheckedAudio;
}): Promise<Recording> {
  // The stored name is a generated id, never the uploaded name. File first, rows second: if the rows cannot
  // be written the file is removed again, so neither is ever left without the other.
  const storageKey = crypto.randomUUID();
  await objectStore().put(storageKey, fs.createReadStream(opts.spoolFile), opts.audio.mimeType);
  try {
    return await sequelize.transaction(async (t) => {
      const recording = await Recording.create(
        {
          songId: opts.song.id,
          ownerId: opts.ownerId,
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
    await objectStore().remove(storageKey).catch(() => {});
    throw err;
  }
}

async function canRead(user: Me, ownerId: string): Promise<boolean> {
  if (ownerId === user.id || user.role === 'admin') return true;
  return user.role === 'teacher' && (await StudioLink.count({ where: { teacherId: user.id, studentId: ownerId } })) > 0;
}

/** The owner, their linked teacher and an admin may read; anyone else is told it does not exist. */
export async function recordingForReader(user: Me, id: string): Promise<Recording> {
  const r = await Recording.findByPk(id);
  if (!r || !(await canRead(user, r.ownerId))) throw notFound('recording');
  return r;
}

export async function recordingForOwner(user: Me, id: string): Promise<Recording> {
  const r = await Recording.findByPk(id);
  if (!r || r.ownerId !== user.id) throw notFound('recording');
  return r;
}

export async function listRecordings(songId: string): Promise<Recording[]> {
  return Recording.findAll({ where: { songId }, order: [['createdAt', 'DESC']] });
}

export async function toRecordingDto(r: Recording, analysis?: Analysis | null): Promise<RecordingDto> {
  const a = analysis === undefined ? await Analysis.findByPk(r.id) : analysis;
  const result = a ? JSON.parse(a.result) : null;
  return {
    id: r.id,
    songId: r.songId,
    ownerId: r.ownerId,
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
    analysis: result,
    createdAt: r.createdAt.toISOString(),
  };
}

export async function patchRecording(r: Recording, patch: RecordingPatch): Promise<Recording> {
  return r.update(patch as Partial<Recording>);
}

/** Rows first (one transaction), then the files: a failed delete leaves everything in place. */
export async function deleteRecordings(where: { id?: string; songId?: string }): Promise<void> {
  const rows = await Recording.findAll({ where });
  await sequelize.transaction(async (t) => {
    await Recording.destroy({ where, transaction: t });
  });
  for (const r of rows) await objectStore().remove(r.storageKey).catch((err) => console.error('[tactus] could not remove a stored file:', err));
}

export async function deleteSong(song: Song): Promise<void> {
  const keys = (await Recording.findAll({ where: { songId: song.id }, attributes: ['storageKey'] })).map((r) => r.storageKey);
  await song.destroy();
  for (const key of keys) await objectStore().remove(key).catch((err) => console.error('[tactus] could not remove a stored file:', err));
}
