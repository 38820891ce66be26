import { Router } from 'express';
import rangeParser from 'range-parser';
import { handler, HttpError, parseBody } from '@/server/http';
import { currentUser, requireUser } from '@/server/middleware/session';
import { rateLimit } from '@/server/rate-limit';
import { receiveUpload, removeSpooled, spooledFile } from '@/server/middleware/upload';
import { songFor } from '@/server/services/songs';
import {
  addRecording,
  assertMayUploadTo,
  deleteRecording,
  getRecording,
  listRecordings,
  patchRecording,
  recordingAudio,
  recordingPeaks,
  retryRecording,
} from '@/server/services/recordings';
import { RecordingPatchSchema, RecordingUploadFieldsSchema } from '@/shared/schemas';

/** Mounted at /api/songs/:songId/recordings. */
export const songRecordingsRouter = Router({ mergeParams: true });
songRecordingsRouter.use(requireUser);

songRecordingsRouter.get(
  '/',
  handler(async (req, res) => {
    const song = await songFor(currentUser(req), 'read', String(req.params.songId));
    res.json({ recordings: await listRecordings(currentUser(req), song) });
  }),
);

songRecordingsRouter.post(
  '/',
  // Whether this person may add to the song is settled before a byte of the file is accepted.
  (req, _res, next) => {
    assertMayUploadTo(currentUser(req), String(req.params.songId)).then(() => next(), next);
  },
  rateLimit('uploads', (req) => currentUser(req).id, 'You have uploaded many recordings in the last hour.'),
  receiveUpload,
  handler(async (req, res) => {
    try {
      const fields = parseBody(RecordingUploadFieldsSchema, req.body);
      const file = spooledFile(req);
      if (!file) throw new HttpError(400, 'invalid_body', 'file: attach the recording in the field "file"', 'file');
      const upload = {
        kind: fields.kind,
        label: fields.label || null,
        fileName: req.file?.originalname,
        spoolFile: file.path,
        sizeBytes: file.size,
      };
      res.status(201).json(await addRecording(currentUser(req), String(req.params.songId), upload));
    } finally {
      await removeSpooled(req);
    }
  }),
);

export const recordingsRouter = Router();
recordingsRouter.use(requireUser);

recordingsRouter.get(
  '/:id',
  handler(async (req, res) => {
    res.json(await getRecording(currentUser(req), String(req.params.id)));
  }),
);

recordingsRouter.get(
  '/:id/peaks',
  handler(async (req, res) => {
    res.type('json').send(await recordingPeaks(currentUser(req), String(req.params.id)));
  }),
);

/** The stored file, with HTTP ranges (206 / 416) so players can seek without downloading it all. */
recordingsRouter.get(
  '/:id/audio',
  handler(async (req, res) => {
    const audio = await recordingAudio(currentUser(req), String(req.params.id));
    const size = audio.sizeBytes;
    res.setHeader('Accept-Ranges', 'bytes');
    res.setHeader('Content-Type', audio.mimeType);
    res.setHeader('Cache-Control', 'private, max-age=3600');
    const header = req.headers.range;
    if (!header) {
      res.setHeader('Content-Length', String(size));
      (await audio.open()).pipe(res);
      return;
    }
    // RFC 9110 §14.1.2: a suffix range longer than the file means the whole file (range-parser calls it unsatisfiable).
    const suffix = /^bytes=-(\d+)$/.exec(header.trim());
    const ranges =
      suffix && Number(suffix[1]) >= size && size > 0
        ? Object.assign([{ start: 0, end: size - 1 }], { type: 'bytes' })
        : rangeParser(size, header, { combine: true });
    if (ranges === -1 || ranges === -2 || ranges.type !== 'bytes' || ranges.length !== 1) {
      res.setHeader('Content-Range', `bytes */${size}`);
      throw new HttpError(
        416,
        'bad_range',
        `that range cannot be served from this file of ${size} bytes (ask for one bytes range)`,
      );
    }
    const { start, end } = ranges[0]!;
    res.status(206);
    res.setHeader('Content-Range', `bytes ${start}-${end}/${size}`);
    res.setHeader('Content-Length', String(end - start + 1));
    (await audio.open({ start, end })).pipe(res);
  }),
);

recordingsRouter.patch(
  '/:id',
  handler(async (req, res) => {
    const patch = parseBody(RecordingPatchSchema, req.body);
    res.json(await patchRecording(currentUser(req), String(req.params.id), patch));
  }),
);

recordingsRouter.post(
  '/:id/retry',
  handler(async (req, res) => {
    res.status(202).json(await retryRecording(currentUser(req), String(req.params.id)));
  }),
);

recordingsRouter.delete(
  '/:id',
  handler(async (req, res) => {
    await deleteRecording(currentUser(req), String(req.params.id));
    res.status(204).end();
  }),
);
