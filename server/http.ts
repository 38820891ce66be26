// The API's error shape and the helpers that produce it (see ApiErrorSchema in shared/schemas.ts).
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { ConnectionAcquireTimeoutError, ConnectionError } from 'sequelize';
import type { ZodType } from 'zod';
import { log } from './log';

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly field?: string,
    readonly issues?: { field: string; message: string }[],
  ) {
    super(message);
  }
}

/** Too many requests of one kind: 429 with Retry-After, so a client knows when to try again. */
export class TooManyRequests extends HttpError {
  constructor(
    message: string,
    readonly retryAfterSec: number,
  ) {
    super(429, 'too_many_requests', message);
  }
}

export const notFound = (what: string) => new HttpError(404, 'not_found', `${what} not found`);

/** Parses req.body with a zod schema; a bad body becomes a 400 that names the first offending field. */
export function parseBody<T>(schema: ZodType<T>, body: unknown): T {
  return parseWith(schema, body ?? {}, 'invalid_body', '(body)');
}

/** Parses req.query the same way; a bad parameter is a 400 `invalid_query` naming it. */
export function parseQuery<T>(schema: ZodType<T>, query: unknown): T {
  return parseWith(schema, query ?? {}, 'invalid_query', '(query)');
}

function parseWith<T>(schema: ZodType<T>, input: unknown, code: string, whole: string): T {
  const result = schema.safeParse(input);
  if (result.success) return result.data;
  const issues = result.error.issues.map((i) => ({ field: i.path.join('.') || whole, message: i.message }));
  const first = issues[0]!;
  throw new HttpError(400, code, `${first.field}: ${first.message}`, first.field, issues);
}

/** Express 5 passes rejected promises to the error handler; this only narrows the types. */
export const handler =
  (fn: (req: Request, res: Response) => Promise<unknown> | unknown): RequestHandler =>
  async (req, res, next) => {
    try {
      await fn(req, res);
    } catch (err) {
      next(err);
    }
  };

/** Codes of the MariaDB connector and of Node for a database that is down or a connection that was cut. */
const UNREACHABLE =
  /^(ECONNREFUSED|ECONNRESET|ETIMEDOUT|EPIPE|EHOSTUNREACH|ER_GET_CONNECTION_TIMEOUT|ER_CONNECTION_TIMEOUT|ER_SOCKET_UNEXPECTED_CLOSE|ER_CMD_CONNECTION_CLOSED|ER_CONNECTION_ALREADY_CLOSED|ER_CLOSING_POOL)$/;

/** Whether an error (or one it wraps: Sequelize's `parent`, an Error's `cause`) says the database is out of reach. */
export function isDatabaseUnreachable(err: unknown): boolean {
  for (
    let e = err as { code?: unknown; parent?: unknown; cause?: unknown } | undefined, depth = 0;
    e && depth < 5;
    depth++
  ) {
    if (e instanceof ConnectionError || e instanceof ConnectionAcquireTimeoutError) return true;
    if (typeof e.code === 'string' && UNREACHABLE.test(e.code)) return true;
    e = (e.parent ?? e.cause) as typeof e;
  }
  return false;
}

/** Whether an error says a disk (the spool or the store) is full. */
export const isOutOfSpace = (err: unknown) => ['ENOSPC', 'EDQUOT'].includes(String((err as { code?: unknown })?.code));

export const storageFull = () =>
  new HttpError(
    507,
    'storage_full',
    'Tactus has run out of storage space, so the upload was not kept; try again later',
    'file',
  );

/**
 * Answers are always JSON, even when a route had already set another type (the audio route sets its own), and
 * carry the request id the log line has (never a stack trace).
 */
export function errorHandler(err: unknown, req: Request, res: Response, _next: NextFunction) {
  const requestId = String(req.id ?? '');
  const answer = (status: number, error: { code: string; message: string; field?: string; issues?: unknown }) =>
    res
      .type('json')
      .status(status)
      .json({ error: { ...error, requestId } });
  if (err instanceof TooManyRequests) res.set('Retry-After', String(err.retryAfterSec));
  if (err instanceof HttpError) {
    answer(err.status, { code: err.code, message: err.message, field: err.field, issues: err.issues });
    return;
  }
  const e = err as { type?: string; status?: number; message?: string };
  if (e?.type === 'entity.parse.failed') {
    answer(400, { code: 'invalid_json', message: 'the request body is not valid JSON' });
    return;
  }
  if (e?.type === 'entity.too.large') {
    answer(413, { code: 'too_large', message: 'the request body is too large' });
    return;
  }
  // Other refusals that Express and its body parser mark as the client's (an unknown charset or
  // Content-Encoding, a broken gzip body, a path that does not decode): their own 4xx, in our shape, with
  // their words only where they are ours to show.
  const status = e?.status ?? (err as { statusCode?: number })?.statusCode;
  if (typeof status === 'number' && status >= 400 && status < 500) {
    const known: Record<string, [string, string]> = {
      'charset.unsupported': ['unsupported_charset', 'send the body as UTF-8'],
      'encoding.unsupported': [
        'unsupported_encoding',
        'send the body uncompressed, or compressed with gzip, deflate or br',
      ],
      'request.aborted': ['aborted', 'the request was cut off before its body arrived'],
    };
    const [code, message] =
      (e?.type && known[e.type]) ||
      (err instanceof URIError
        ? ['bad_path', 'the address is not valid (it has a broken % escape)']
        : ['bad_request', 'the request could not be read']);
    answer(status, { code, message });
    return;
  }
  if (isOutOfSpace(err)) {
    const full = storageFull();
    answer(full.status, { code: full.code, message: full.message, field: full.field });
    return;
  }
  if (isDatabaseUnreachable(err)) {
    // Nothing was written (each change is one transaction); the pool reconnects once the database is back.
    res.setHeader('Retry-After', '5');
    answer(503, { code: 'unavailable', message: 'Tactus cannot reach its database just now; try again in a moment' });
    return;
  }
  // The stack goes to the log, under the request id the answer names; the answer says only that it failed.
  (req.log ?? log).error({ err }, 'unexpected error');
  answer(500, { code: 'internal', message: 'something went wrong on our side' });
}
