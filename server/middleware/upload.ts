// Multipart uploads through multer, streamed to a spool file under a generated name while they arrive.
// The size limit stops the transfer as soon as it is passed; every way out removes the spool file.
import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import multer from 'multer';
import type { NextFunction, Request, Response } from 'express';
import { config } from '@/server/config';
import { HttpError, isOutOfSpace, storageFull } from '@/server/http';

interface SpooledFile {
  path: string;
  size: number;
}

const spoolEngine: multer.StorageEngine = {
  _handleFile(_req, file, cb) {
    fs.mkdirSync(config.storage.spoolDir, { recursive: true });
    const target = path.join(config.storage.spoolDir, `upload-${crypto.randomBytes(12).toString('hex')}`);
    const out = fs.createWriteStream(target, { flags: 'wx' });
    let size = 0;
    let failed = false;
    const bail = (err: Error) => {
      if (failed) return;
      failed = true;
      out.destroy();
      fs.rm(target, { force: true }, () => cb(err));
    };
    file.stream.on('data', (chunk: Buffer) => (size += chunk.length));
    file.stream.on('error', bail);
    // multer ends the file stream early when the limit is reached and reports LIMIT_FILE_SIZE; the partial
    // spool file must go as well.
    file.stream.on('limit', () => bail(new multer.MulterError('LIMIT_FILE_SIZE', file.fieldname)));
    out.on('error', bail);
    out.on('finish', () => {
      if (!failed) cb(null, { path: target, size } as Partial<Express.Multer.File>);
    });
    file.stream.pipe(out);
  },
  _removeFile(_req, file, cb) {
    fs.rm((file as unknown as SpooledFile).path, { force: true }, () => cb(null));
  },
};

const parser = multer({
  storage: spoolEngine,
  limits: { fileSize: config.uploads.maxBytes, files: 1, fields: 8, fieldSize: 4096 },
  // Keep the name as sent, so one with folders in it can be refused instead of silently shortened.
  preservePath: true,
  // Browsers send file names as UTF-8 (HTML's form encoding); read them so ("Tomás – café.mp3"), not as Latin-1.
  defParamCharset: 'utf8',
}).single('file');

const megabytes = (n: number) => `${Math.round(n / (1024 * 1024))} MB`;

/** Parses `multipart/form-data` with one `file`; turns multer's errors into clear API errors. */
export function receiveUpload(req: Request, res: Response, next: NextFunction) {
  if (!req.is('multipart/form-data'))
    return next(
      new HttpError(400, 'invalid_body', 'send the recording as multipart/form-data with the field "file"', 'file'),
    );
  parser(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') {
        // The rest of the body is not wanted: say so and close the connection after the answer.
        res.setHeader('Connection', 'close');
        return next(
          new HttpError(
            413,
            'too_large',
            `the file is larger than the ${megabytes(config.uploads.maxBytes)} limit`,
            'file',
          ),
        );
      }
      if (err.code === 'LIMIT_UNEXPECTED_FILE')
        return next(
          new HttpError(400, 'invalid_body', `send one file, in the field "file" (got "${err.field}")`, 'file'),
        );
      return next(
        new HttpError(400, 'invalid_body', `the upload could not be read: ${err.message}`, err.field ?? 'file'),
      );
    }
    // The spool's disk is full: the partial file is gone already (bail above); say so rather than blame the upload.
    if (isOutOfSpace(err)) return next(storageFull());
    next(new HttpError(400, 'invalid_body', `the upload could not be read: ${(err as Error).message}`, 'file'));
  });
}

export const spooledFile = (req: Request) => req.file as unknown as SpooledFile | undefined;
/** Off the request thread: unlinking a 100 MB file while the disk is busy can take a while. */
export const removeSpooled = async (req: Request) => {
  const f = spooledFile(req);
  if (f) await fs.promises.rm(f.path, { force: true });
};

/** At start-up: spool files left by a process that died mid-upload. Only this process's folder is touched. */
export function cleanSpool() {
  fs.mkdirSync(config.storage.spoolDir, { recursive: true });
  const hourAgo = Date.now() - 60 * 60 * 1000;
  for (const name of fs.readdirSync(config.storage.spoolDir)) {
    const file = path.join(config.storage.spoolDir, name);
    if (fs.statSync(file).mtimeMs < hourAgo) fs.rmSync(file, { force: true });
  }
}
