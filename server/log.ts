// The server's one logger (pino) and its request logging (pino-http): JSON lines to the log file or stdout.
import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import pino from 'pino';
import { pinoHttp } from 'pino-http';
import { config } from './config';

export const log = pino(
  { level: config.log.level, base: { pid: process.pid } },
  config.log.file ? pino.destination({ dest: config.log.file, mkdir: true, sync: false }) : pino.destination(1),
);

/** A caller's X-Request-Id is kept when it is short and plain (letters, digits, . _ : -); otherwise we make one. */
export const SANE_REQUEST_ID = /^[A-Za-z0-9._:-]{1,64}$/;

function requestId(req: IncomingMessage, res: ServerResponse): string {
  const given = req.headers['x-request-id'];
  const id = typeof given === 'string' && SANE_REQUEST_ID.test(given) ? given : randomUUID();
  res.setHeader('X-Request-Id', id);
  return id;
}

/** Tokens travel in some paths and queries (mailed links, invitations): the log keeps the path, masked. */
export const loggablePath = (url: string | undefined) =>
  (url ?? '').split('?')[0]!.replace(/\/token\/[^/]+/, '/token/…');

export const requestLogger = pinoHttp({
  logger: log,
  genReqId: requestId,
  // Health probes every few seconds would bury everything else.
  autoLogging: { ignore: (req) => req.url === '/api/health' },
  customLogLevel: (_req, res, err) =>
    err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info',
  // Short lines: no headers (cookies live there), no query strings (tokens live there).
  serializers: {
    req: (req: { id: string; method: string; url: string; remoteAddress?: string }) => ({
      id: req.id,
      method: req.method,
      path: loggablePath(req.url),
      remoteAddress: req.remoteAddress,
    }),
    res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
  },
});
