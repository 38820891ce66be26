// The API's error shape and the helpers that produce it (see ApiErrorSchema in shared/schemas.ts).
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { ZodType } from 'zod';

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

export const notFound = (what: string) => new HttpError(404, 'not_found', `${what} not found`);

/** Parses req.body with a zod schema; a bad body becomes a 400 that names the first offending field. */
export function parseBody<T>(schema: ZodType<T>, body: unknown): T {
  const result = schema.safeParse(body ?? {});
  if (result.success) return result.data;
  const issues = result.error.issues.map((i) => ({ field: i.path.join('.') || '(body)', message: i.message }));
  const first = issues[0]!;
  throw new HttpError(400, 'invalid_body', `${first.field}: ${first.message}`, first.field, issues);
}

/** Express 5 passes rejected promises to the error handler; this only narrows the types. */
export const handler = (fn: (req: Request, res: Response) => Promise<unknown> | unknown): RequestHandler =>
  async (req, res, next) => {
    try {
      await fn(req, res);
    } catch (err) {
      next(err);
    }
  };

export function errorHandler(err: unknown, _req: Request, res: Response, _next: NextFunction) {
  if (err instanceof HttpError) {
    res.status(err.status).json({ error: { code: err.code, message: err.message, field: err.field, issues: err.issues } });
    return;
  }
  const e = err as { type?: string; status?: number; message?: string };
  if (e?.type === 'entity.parse.failed') {
    res.status(400).json({ error: { code: 'invalid_json', message: 'the request body is not valid JSON' } });
    return;
  }
  if (e?.type === 'entity.too.large') {
    res.status(413).json({ error: { code: 'too_large', message: 'the request body is too large' } });
    return;
  }
  console.error('[tactus] unexpected error:', err);
  res.status(500).json({ error: { code: 'internal', message: 'something went wrong on our side' } });
}
