// What stands in front of better-auth (/api/auth/*): bounded bodies, our checks of the fields it stores
// unchecked, and the rate limits on sign-in, sign-up and the mails it sends.
import express, { type Request, type RequestHandler, type Response } from 'express';
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
