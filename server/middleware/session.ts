// Who is asking: every /api route below the auth handler passes through loadUser; roles are checked here.
import type { NextFunction, Request, Response } from 'express';
import { fromNodeHeaders } from 'better-auth/node';
import { auth } from '@/server/auth';
import { HttpError } from '@/server/http';
import type { Me, Role } from '@/shared/schemas';

declare module 'express-serve-static-core' {
  interface Request {
    user?: Me;
  }
}

export async function loadUser(req: Request, _res: Response, next: NextFunction) {
  try {
    const session = await auth.api.getSession({ headers: fromNodeHeaders(req.headers) });
    if (session) {
      const u = session.user as typeof session.user & { role?: Role };
      req.user = { id: u.id, name: u.name, email: u.email, emailVerified: u.emailVerified, role: u.role ?? 'player' };
    }
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
