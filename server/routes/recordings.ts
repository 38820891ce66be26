import { Router } from 'express';
import rangeParser from 'range-parser';
import { config } from '@/server/config';
import { handler, HttpError, parseBody } from '@/server/http';
import { currentUser, requireUser } from '@/server/middleware/session';
import { receiveUpload, removeSpooled, spooledFile } from '@/server/middleware/upload';
import { checkAudio } from '@/server/analysis/audio-check';
import { Analysis } from '@/server/models';
import { objectStore } from '@/server/storage';
import { analysisRunner } from '@/server/jobs/runner';
import { retry } from '@/server/jobs/queue';
import { songForOwner, songForReader } from '@/server/services/songs';
import {
  checkFileName,
  deleteRecordings,
  listRecordings,
  patchRecording,
  recordingForOwner,
  recordingForReader,
  storeRecording,
  toRecordingDto,
} from '@/server/services/recordings';
import { RecordingPatchSchema, RecordingUploadFieldsSchema } from '@/shared/schemas';

/** Mounted at /api/songs/:songId/recordings. */
export const songRecordingsRouter = Router({ mergeParams: true });
songRecordingsRouter.use(requireUser);

songRecordingsRouter.get('/', handler(async (req, res) => {
  const song = await songForReader(currentUser(req), String(req.params.songId));
  const rows = await listRecordings(song.id);
  // One query for all their analyses, not one per recording.
  const analyses = new Map((await Analysis.findAll({ where: { recordingId: rows.map((r) => r.id) } })).map((a) => [a.recordingId, a]));
  res.json({ recordings: await Promise.all(rows.map((r) => toRecordingDto(r, analyses.get(r.id) ?? null))) });
}));

songRecordingsRouter.post(
  '/',
  // Ownership is checked before a byte of the file is accepted.
  (req, _res, next) => {
    songForOwner(currentUser(req), String(req.params.songId)).then(() => next(), next);
  },
  receiveUpload,
  handler(async (req, res) => {
    try {
      const fields = parseBody(RecordingUploadFieldsSchema, req.body);
      const file = spooledFile(req);
      if (!file) throw new HttpError(400, 'invalid_body', 'file: attach the recording in the field "file"', 'file');
      const originalName = checkFileName(req.file?.originalname);
      const audio = await checkAudio(file.path, config.uploads.maxDurationSec);
      const song = await songForOwner(currentUser(req), String(req.params.songId));
      const recording = await storeRecording({
        song,
        ownerId: currentUser(req).id,
        kind: fields.kind,
        label: fields.label || null,
        originalName,
        spoolFile: file.path,
        sizeBytes: file.size,
        audio,
      });
      analysisRunner()?.poke();
      res.status(201).json(await toRecordingDto(recording, null));
    } finally {
      removeSpooled(req);
    }
  }),
);

export const recordingsRouter = Router();
recordingsRouter.use(requireUser);

recordingsRouter.get('/:id', handler(async (req, res) => {
  res.json(await toRecordingDto(await recordingForReader(currentUser(req), String(req.params.id))));
}));

recordingsRouter.get('/:id/peaks', handler(async (req, res) => {
  const r = await recordingForReader(currentUser(req), String(req.params.id));
  const a = await Analysis.findByPk(r.id);
  if (!a) throw new HttpError(409, 'not_ready', `the waveform is not ready yet (analysis ${r.status})`);
  res.type('json').send(a.peaks);
}));

/** The stored file, with HTTP ranges (206 / 416) so players can seek without downloading it all. */
recordingsRouter.get('/:id/audio', handler(async (req, res) => {
  const r = await recordingForReader(currentUser(req), String(req.params.id));
  const size = r.sizeBytes;
  res.setHeader('Accept-Ranges', 'bytes');
  res.setHeader('Content-Type', r.mimeType);
  res.setHeader('Cache-Control', 'private, max-age=3600');
  const header = req.headers.range;
  if (!header) {
    res.setHeader('Content-Length', String(size));
    (await objectStore().read(r.storageKey)).pipe(res);
    return;
  }
  const ranges = rangeParser(size, header, { combine: true });
  if (ranges === -1 || ranges === -2 || ranges.type !== 'bytes' || ranges.length !== 1) {
    res.setHeader('Content-Range', `bytes */${size}`);
    throw new HttpError(416, 'bad_range', `the range ${header} cannot be served from ${size} bytes (one bytes range, please)`);
  }
  const { start, end } = ranges[0]!;
  res.status(206);
  res.setHeader('Content-Range', `bytes ${start}-${end}/${size}`);
  res.setHeader('Content-Length', String(end - start + 1));
  (await objectStore().read(r.storageKey, { start, end })).pipe(res);
}));

recordingsRouter.patch('/:id', handler(async (req, res) => {
  const patch = parseBody(RecordingPatchSchema, req.body);
  const r = await recordingForOwner(currentUser(req), String(req.params.id));
  if (patch.beatOffsetSec != null && patch.beatOffsetSec > r.durationSec) {
    throw new HttpError(400, 'invalid_body', 'beatOffsetSec: must lie within the recording', 'beatOffsetSec');
  }
  res.json(await toRecordingDto(await patchRecording(r, patch)));
}));

recordingsRouter.post('/:id/retry', handler(async (req, res) => {
  const r = await recordingForOwner(currentUser(req), String(req.params.id));
  if (!(await retry(r.id))) throw new HttpError(409, 'not_failed', 'only a failed analysis can be retried');
  analysisRunner()?.poke();
  res.status(202).json(await toRecordingDto(await r.reload()));
}));

recordingsRouter.delete('/:id', handler(async (req, res) => {
  const r = await recordingForOwner(currentUser(req), String(req.params.id));
  await deleteRecordings({ id: r.id });
  res.status(204).end();
}));
