// listRoutes against a small Express app built like server/app.ts, and against what that app really answers:
// every listed route must be served, and a method the listing leaves out must fall through to the 404.
import express, { Router } from 'express';
import request from 'supertest';
import { joinPath, listRoutes, toOpenApiPath } from '@/server/route-table';

const ok: express.RequestHandler = (_req, res) => {
  res.sendStatus(200);
};

function sampleApp() {
  const app = express();
  app.all('/api/auth/{*splat}', ok);
  app.get('/api/health', ok);

  // Mounted without a prefix, its paths written out in full (as server/routes/dev.ts does).
  const dev = Router();
  dev.get('/api/dev/mail', ok);
  dev.get('/dev/mail', ok);
  app.use(dev);

  app.use('/api', (_req, _res, next) => next()); // plain middleware: not a route
  const items = Router({ mergeParams: true });
  items.get('/', ok);
  items.post('/', ok);
  items.route('/:id').get(ok).patch(ok).delete(ok);
  app.use('/api/songs/:songId/items', items);

  const inner = Router();
  inner.get('/leaf/:leafId', ok);
  const outer = Router();
  outer.use('/inner', inner);
  app.use('/api/outer', outer);

  app.get('/{*splat}', ok); // the web build's fallback: not under /api
  app.use((_req, res) => {
    res.sendStatus(404);
  });
  return app;
}

test('lists every /api route with its method and full path, mount prefixes included, in matching order', () => {
  expect(listRoutes(sampleApp())).toEqual([
    // app.all registers every method (express/lib/application.js): one ALL entry.
    { method: 'ALL', path: '/api/auth/{*splat}' },
    // No HEAD entries: Express answers HEAD with the GET handler unless app.head() came first (Express 5 API
    // reference, app.METHOD; from memory).
    { method: 'GET', path: '/api/health' },
    { method: 'GET', path: '/api/dev/mail' },
    { method: 'GET', path: '/api/songs/:songId/items' },
    { method: 'POST', path: '/api/songs/:songId/items' },
    { method: 'GET', path: '/api/songs/:songId/items/:id' },
    { method: 'PATCH', path: '/api/songs/:songId/items/:id' },
    { method: 'DELETE', path: '/api/songs/:songId/items/:id' },
    { method: 'GET', path: '/api/outer/inner/leaf/:leafId' },
  ]);
});

test('every listed route is served by the app, and a method it does not list is not', async () => {
  const app = sampleApp();
  const routes = listRoutes(app);
  for (const r of routes) {
    const path = r.path.replace('{*splat}', 'sign-in/email').replace(/:(\w+)/g, 'x-$1');
    const methods = r.method === 'ALL' ? ['get', 'post', 'delete'] : [r.method.toLowerCase()];
    for (const m of methods) {
      const res = await request(app)[m as 'get'](path);
      expect({ route: `${m} ${path}`, status: res.status }).toEqual({ route: `${m} ${path}`, status: 200 });
    }
  }
  // Not listed, not served: the catch-all 404 answers.
  await request(app).delete('/api/health').expect(404);
  await request(app).put('/api/songs/s1/items/i1').expect(404);
  await request(app).post('/api/dev/mail').expect(404);
});

test('paths join as Express matches them', () => {
  expect(joinPath('', '/')).toBe('/');
  expect(joinPath('/', '/api/dev/mail')).toBe('/api/dev/mail');
  expect(joinPath('/api/songs', '/')).toBe('/api/songs');
  expect(joinPath('/api/songs', '/:id')).toBe('/api/songs/:id');
});

test('Express parameters become OpenAPI path templates; wildcards have none', () => {
  // OpenAPI 3.1.0 §4.8.2 "Path Templating": parameters in curly braces.
  expect(toOpenApiPath('/api/songs/:songId/recordings')).toBe('/api/songs/{songId}/recordings');
  expect(toOpenApiPath('/api/admin/users/:id/role')).toBe('/api/admin/users/{id}/role');
  expect(toOpenApiPath('/api/health')).toBe('/api/health');
  expect(toOpenApiPath('/api/auth/{*splat}')).toBeNull();
});
