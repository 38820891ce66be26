// Who is asking: every /api route below the auth handler passes through loadUser; roles are checked here.
import type { NextFunction, Request, Response } from 'express';
import { fromNodeHeaders } from 'better-auth/node';
import { auth } from '@/server/auth';
import { config } from '@/server/config';
import { HttpError } from '@/server/http';
import type { Me, Role } from '@/shared/schemas';

declare module 'express-serve-static-core' {
  interface Request {
    user?: Me;
  }
}

/**
 * Who a session cookie belongs to, remembered for a few seconds per process: better-auth's lookup (cookie
 * signature, session row, user row) was most of the cost of a cheap read such as GET /api/songs. Whatever
 * goes through /api/auth with the cookie (sign-out, changes to the account) forgets it at once, and so does
 * a change of role; another server process sees such a change at most `sessionMemoMs` later.
 */
const memo = new Map<string, { user: Promise<Me | null>; until: number }>();
const MEMO_MAX = 10_000;

/** The session token cookie's value (better-auth's name, with the __Secure- prefix it takes over HTTPS). */
const memoKey = (req: Request) =>
  /(?:^|;\s*)(?:__Secure-)?better-auth\.session_token=([^;]+)/.exec(req.headers.cookie ?? '')?.[1] ?? null;

async function lookUp(req: Request): Promise<Me | null> {
  const session = await auth.api.getSession({ headers: fromNodeHeaders(req.headers) });
  if (!session) return null;
  const u = session.user as typeof session.user & { role?: Role };
  return { id: u.id, name: u.name, email: u.email, emailVerified: u.emailVerified, role: u.role ?? 'player' };
}

function rememberedUser(req: Request): Promise<Me | null> {
  const key = memoKey(req);
  if (!key || config.sessionMemoMs <= 0) return lookUp(req);
  const now = Date.now();
  const hit = memo.get(key);
  if (hit && hit.until > now) return hit.user;
  if (memo.size >= MEMO_MAX) memo.delete(memo.keys().next().value!);
  const user = lookUp(req);
  memo.set(key, { user, until: now + config.sessionMemoMs });
  // A failed lookup (the database away) is not remembered.
  user.catch(() => memo.delete(key));
  return user;
}

/** Before the auth handler: the cookie's remembered session is dropped (sign-out, account changes). */
export function forgetSession(req: Request, _res: Response, next: NextFunction) {
  const key = memoKey(req);
  if (key) memo.delete(key);
  next();
}

/** After a change to a person that their session carries (their role): every remembered session of theirs goes. */
export async function forgetSessionsOf(userId: string) {
  for (const [key, entry] of memo) if ((await entry.user.catch(() => null))?.id === userId) memo.delete(key);
}

export async function loadUser(req: Request, _res: Response, next: NextFunction) {
  try {
    const user = await rememberedUser(req);
    if (user) req.user = { ...user };
    next();
  } catch (err) {
    next(err);
  }
}

export function requireUser(req: Request, _res: Response, next: NextFunction) {
  if (!req.user) return next(new HttpError(401, 'unauthenticated', 'sign in first'));
  next();
}

export const requireRole =
  (...roles: Role[]) =>
  (req: Request, _res: Response, next: NextFunction) => {
    if (!req.user) return next(new HttpError(401, 'unauthenticated', 'sign in first'));
    if (!roles.includes(req.user.role))
      return next(new HttpError(403, 'forbidden', `this needs the ${roles.join(' or ')} role`));
    next();
  };

/** The signed-in user; only call behind requireUser. */
export const currentUser = (req: Request): Me => req.user!;
