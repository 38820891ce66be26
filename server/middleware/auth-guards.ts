// What stands in front of better-auth (/api/auth/*): bounded bodies, our checks of the fields it stores
// unchecked, and the rate limits on sign-in, sign-up and the mails it sends; and its handler, whose refusals
// carry the request id as ours do.
import express, { type Request, type RequestHandler, type Response } from 'express';
import { toNodeHandler } from 'better-auth/node';
import { auth } from '@/server/auth';
import { config } from '@/server/config';
import { HttpError, parseBody } from '@/server/http';
import { consume, digest, forget } from '@/server/rate-limit';
import { SignUpFieldsSchema, UpdateUserSchema } from '@/shared/schemas';

const address = (req: Request) => req.ip ?? 'unknown';
const emailOf = (req: Request) => {
  const email = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' ? email : '';
};
/** Failures are counted per account and address: a stranger guessing cannot lock the owner out elsewhere. */
const accountAtAddress = (req: Request) => `${address(req)}|${digest(emailOf(req))}`;

type Guard = (req: Request, res: Response) => Promise<void> | void;

const mailGuard: Guard = async (req) => {
  // Each of these sends a mail: limited per address asked about and per network asking.
  await consume('mailPerAddress', address(req), 'Too many mails asked for from your network.');
  await consume('mailPerAccount', digest(emailOf(req)), 'We have sent several mails to this address already.');
};

/** better-auth's endpoints that get a check of ours first (the path is below /api/auth). */
const GUARDS: Record<string, Guard> = {
  // Every attempt is counted before better-auth answers (so a quick run of guesses cannot slip between the
  // answer and the count), and a successful sign-in clears the account's count again.
  'POST /sign-in/email': async (req, res) => {
    const key = accountAtAddress(req);
    await consume('signInPerAddress', address(req), 'Too many sign-in attempts from your network.');
    await consume(
      'signInFailures',
      key,
      'Too many wrong passwords for this account.',
      'choose a new one with “Forgot your password?”',
    );
    res.on('finish', () => {
      if (res.statusCode === 200) void forget('signInFailures', key);
    });
  },
  'POST /sign-up/email': async (req) => {
    req.body = parseBody(SignUpFieldsSchema, req.body);
    await consume('signUp', address(req), 'Too many new accounts from your network.');
  },
  'POST /request-password-reset': mailGuard,
  'POST /forget-password': mailGuard,
  'POST /send-verification-email': mailGuard,
  // better-auth would store a name of any type or length (true became "1"); only plain, bounded text passes.
  'POST /update-user': (req) => {
    req.body = parseBody(UpdateUserSchema, req.body);
  },
};

/**
 * Mounted at /api/auth in front of better-auth. A larger Content-Length than the limit is refused before a
 * byte is read, and the connection closed (the body parser would first read the rest off the socket). A body
 * without a length is read only up to the limit. JSON is parsed here, anything else kept as text; better-auth
 * takes either from req.body instead of the socket. Then the endpoint's guard, if it has one.
 */
export const authGuards: RequestHandler[] = [
  (req, res, next) => {
    if (Number(req.headers['content-length'] ?? 0) <= config.maxJsonBytes) return next();
    res.set('Connection', 'close');
    next(new HttpError(413, 'too_large', 'the request body is too large'));
  },
  express.json({ limit: config.maxJsonBytes }),
  express.text({ type: () => true, limit: config.maxJsonBytes }),
  (req, res, next) => {
    const guard = GUARDS[`${req.method} ${req.path}`];
    if (!guard) return next();
    Promise.resolve()
      .then(() => guard(req, res))
      .then(() => next(), next);
  },
];

/**
 * A refusal of better-auth's (4xx/5xx) with the request id in its body, as every error of ours has: its own
 * JSON ({ code, message }, which its client reads) gains `requestId`; an answer without a JSON object (an
 * empty 404 for a path it does not know) becomes { code, message, requestId }.
 */
export async function withRequestId(answer: globalThis.Response, requestId: string): Promise<globalThis.Response> {
  if (answer.status < 400) return answer;
  const text = await answer.text();
  let body: unknown = null;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    body = null;
  }
  const refusal =
    body && typeof body === 'object' && !Array.isArray(body)
      ? { ...(body as Record<string, unknown>), requestId }
      : {
          code: answer.status === 404 ? 'NOT_FOUND' : 'REQUEST_FAILED',
          message: answer.status === 404 ? 'no such sign-in or account address' : `request failed (${answer.status})`,
          requestId,
        };
  const headers = new Headers(answer.headers);
  headers.set('content-type', 'application/json');
  headers.delete('content-length');
  return new Response(JSON.stringify(refusal), { status: answer.status, statusText: answer.statusText, headers });
}

/** better-auth's own handler, its error answers given the request's id (`withRequestId`). */
export const authHandler: RequestHandler = (req, res) =>
  toNodeHandler(async (request: globalThis.Request) => withRequestId(await auth.handler(request), String(req.id)))(
    req,
    res,
  );
