// The server's one logger (pino) and its request logging (pino-http): JSON lines to the log file or stdout.
import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import { monitorEventLoopDelay } from 'node:perf_hooks';
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

const mb = (bytes: number) => Math.round((bytes / (1024 * 1024)) * 10) / 10;

/**
 * Every `everyMs`, one `process stats` line: memory split as Node sees it (rss is everything, the worker
 * threads' heaps included; heapUsed/heapTotal are the main thread's JavaScript; external and arrayBuffers are
 * Buffers and other memory outside that heap) and how late the event loop ran in that interval (p99 and max:
 * what held every request up). For the benchmarks, and for a look at a live server.
 */
export function startProcessStats(everyMs: number) {
  if (everyMs <= 0) return () => undefined;
  const delay = monitorEventLoopDelay({ resolution: 10 });
  delay.enable();
  const timer = setInterval(() => {
    const m = process.memoryUsage();
    log.info(
      {
        stats: {
          rssMb: mb(m.rss),
          heapUsedMb: mb(m.heapUsed),
          heapTotalMb: mb(m.heapTotal),
          externalMb: mb(m.external),
          arrayBuffersMb: mb(m.arrayBuffers),
          loopDelayP99Ms: Math.round(delay.percentile(99) / 1e5) / 10,
          loopDelayMaxMs: Math.round(delay.max / 1e5) / 10,
        },
      },
      'process stats',
    );
    delay.reset();
  }, everyMs);
  timer.unref();
  return () => {
    clearInterval(timer);
    delay.disable();
  };
}
