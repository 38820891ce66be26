// The Express app (no listen): auth handler, JSON API, development helpers and, when asked, the web build.
import fs from 'node:fs';
import path from 'node:path';
import express from 'express';
import { config } from './config';
import { databaseState } from './db';
import { errorHandler, HttpError } from './http';
import { requestLogger } from './log';
import { authGuards, authHandler } from './middleware/auth-guards';
import { sameOriginOnly, securityHeaders } from './middleware/security';
import { buildOpenApiDocument, openApiRouter } from './openapi';
import { forgetSession, loadUser } from '@/server/middleware/session';
import { adminRouter } from '@/server/routes/admin';
import { devRouter } from '@/server/routes/dev';
import { meRouter } from '@/server/routes/me';
import { songsRouter } from '@/server/routes/songs';
import { studentsRouter, teachersRouter } from '@/server/routes/students';
import { invitationsRouter } from '@/server/routes/invitations';
import { recordingsRouter, songRecordingsRouter } from '@/server/routes/recordings';
import { candidatesRouter, songTemposRouter } from '@/server/routes/tempos';
import { practiceRouter, songPracticeRouter } from '@/server/routes/practice';
import { passagesRouter, songPassagesRouter } from '@/server/routes/passages';
import { notesRouter, recordingNotesRouter } from '@/server/routes/notes';
import { setListsRouter } from '@/server/routes/setlists';
import { recordingTempoMarksRouter, tempoMarksRouter } from '@/server/routes/tempo-marks';
import type { Health } from '@/shared/schemas';

const { version } = require('../package.json') as { version: string };

export function createApp(opts: { serveWeb?: boolean } = {}) {
  const app = express();
  app.disable('x-powered-by');
  // The server listens on loopback only: whatever is in front of it (a reverse proxy) says who the client is.
  app.set('trust proxy', 'loopback');
  app.use(requestLogger);
  app.use(securityHeaders);
  app.use('/api', sameOriginOnly);

  // better-auth behind our guards: bounded bodies, checked names, rate limits (server/middleware/auth-guards.ts).
  // It reads the raw body itself, so it is mounted before the JSON parser.
  app.use('/api/auth', ...authGuards);
  app.all('/api/auth/{*splat}', forgetSession, authHandler);

  app.use(express.json({ limit: config.maxJsonBytes }));

  app.get('/api/health', async (_req, res) => {
    const database = await databaseState();
    const body: Health = { status: database === 'up' ? 'ok' : 'degraded', database, version };
    res.status(database === 'up' ? 200 : 503).json(body);
  });

  if (config.devTools) app.use(devRouter);
  // The API described (server/openapi.ts); the readable page only where the development helpers are.
  app.use(
    '/api',
    openApiRouter(buildOpenApiDocument({ devTools: config.devTools }), { referencePage: config.devTools }),
  );

  app.use('/api', loadUser);
  app.use('/api/me', meRouter);
  app.use('/api/songs/:songId/recordings', songRecordingsRouter);
  app.use('/api/songs/:songId/practice', songPracticeRouter);
  app.use('/api/practice', practiceRouter);
  app.use('/api/songs/:songId/passages', songPassagesRouter);
  app.use('/api/passages', passagesRouter);
  app.use('/api/songs/:songId', songTemposRouter);
  app.use('/api/candidates', candidatesRouter);
  app.use('/api/songs', songsRouter);
  app.use('/api/recordings/:recordingId/notes', recordingNotesRouter);
  app.use('/api/notes', notesRouter);
  app.use('/api/recordings/:recordingId/tempo-marks', recordingTempoMarksRouter);
  app.use('/api/tempo-marks', tempoMarksRouter);
  app.use('/api/recordings', recordingsRouter);
  app.use('/api/set-lists', setListsRouter);
  app.use('/api/students', studentsRouter);
  app.use('/api/teachers', teachersRouter);
  app.use('/api/invitations', invitationsRouter);
  app.use('/api/admin', adminRouter);
  app.use('/api', (req, _res, next) => next(new HttpError(404, 'not_found', `no API route ${req.method} ${req.path}`)));

  if (opts.serveWeb && fs.existsSync(path.join(config.webDist, 'index.html'))) {
    app.use(express.static(config.webDist, { index: false, maxAge: '1h' }));
    // The web build is a single-page app: every other path gets index.html and the client router takes over.
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(config.webDist, 'index.html')));
  }

  app.use(errorHandler);
  return app;
}
