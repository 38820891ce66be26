import { Router } from 'express';
import { handler, parseBody } from '@/server/http';
import { currentUser, requireRole, requireUser } from '@/server/middleware/session';
import { rateLimit } from '@/server/rate-limit';
import { InviteStudentSchema } from '@/shared/schemas';
import {
  acceptInvitation,
  declineInvitation,
  invitationByToken,
  inviteStudent,
  listReceivedInvitations,
  listSentInvitations,
  withdrawInvitation,
} from '@/server/services/studio';

/** Mounted at /api/invitations: a teacher invites by e-mail; the invited person accepts or declines. */
export const invitationsRouter = Router();

/** The mailed link's page asks this before anyone signs in: the token is the key. */
invitationsRouter.get(
  '/token/:token',
  handler(async (req, res) => {
    res.json(await invitationByToken(String(req.params.token), req.user ?? null));
  }),
);

invitationsRouter.get(
  '/received',
  requireUser,
  handler(async (req, res) => {
    res.json({ invitations: await listReceivedInvitations(currentUser(req)) });
  }),
);

invitationsRouter.post(
  '/:id/accept',
  requireUser,
  handler(async (req, res) => {
    res.json(await acceptInvitation(currentUser(req), String(req.params.id)));
  }),
);

invitationsRouter.post(
  '/:id/decline',
  requireUser,
  handler(async (req, res) => {
    await declineInvitation(currentUser(req), String(req.params.id));
    res.status(204).end();
  }),
);

const teachers = requireRole('teacher', 'admin');

invitationsRouter.get(
  '/',
  teachers,
  handler(async (req, res) => {
    res.json({ invitations: await listSentInvitations(currentUser(req)) });
  }),
);

invitationsRouter.post(
  '/',
  teachers,
  rateLimit('invitations', (req) => currentUser(req).id, 'You have sent many invitations in the last hour.'),
  handler(async (req, res) => {
    const { email } = parseBody(InviteStudentSchema, req.body);
    res.status(202).json(await inviteStudent(currentUser(req), email));
  }),
);

invitationsRouter.delete(
  '/:id',
  teachers,
  handler(async (req, res) => {
    await withdrawInvitation(currentUser(req), String(req.params.id));
    res.status(204).end();
  }),
);
