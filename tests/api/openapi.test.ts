// The API described: /api/openapi.json is a valid OpenAPI document, it names exactly the routes the app
// mounts (server/route-table.ts), and what the running server answers matches it: statuses, bodies, which
// operations need the session cookie and which need a role.
import SwaggerParser from '@apidevtools/swagger-parser';
import Ajv2020 from 'ajv/dist/2020';
import request from 'supertest';
import { toOpenApiPath } from '@/server/route-table';
import { agent, appRoutes, baseUrl, documentedOperations, PASSWORD, signedInUser } from './helpers';

type Operation = {
  security?: unknown[];
  'x-roles'?: string[];
  responses: Record<string, { content?: Record<string, unknown> }>;
};
type Doc = {
  openapi: string;
  paths: Record<string, Record<string, Operation>>;
  components: { securitySchemes: Record<string, { type: string; in: string; name: string }> };
};

let doc: Doc;
let ajv: Ajv2020;
const DOC_ID = 'https://tactus.example/openapi.json';

beforeAll(async () => {
  const res = await request(baseUrl).get('/api/openapi.json').expect(200).expect('content-type', /json/);
  doc = res.body as Doc;
  // OpenAPI 3.1 schemas are JSON Schema 2020-12 (OpenAPI 3.1.0 §4.8.24), so Ajv's 2020 draft checks them.
  ajv = new Ajv2020({ strict: false, allErrors: true });
  ajv.addSchema(doc, DOC_ID);
});

const pointer = (...parts: string[]) =>
  parts.map((p) => encodeURIComponent(p.replace(/~/g, '~0').replace(/\//g, '~1'))).join('/');

/** Checks a real response against the document: its status is documented, and a JSON body fits the documented schema. */
function expectDocumented(method: string, path: string, res: request.Response) {
  const op = doc.paths[path]?.[method];
  expect({ operation: `${method} ${path}`, documented: !!op }).toEqual({
    operation: `${method} ${path}`,
    documented: true,
  });
  const response = op!.responses[String(res.status)];
  expect({ operation: `${method} ${path}`, status: res.status, documented: !!response }).toEqual({
    operation: `${method} ${path}`,
    status: res.status,
    documented: true,
  });
  if (!response!.content?.['application/json']) return;
  const ref = `${DOC_ID}#/${pointer('paths', path, method, 'responses', String(res.status), 'content', 'application/json', 'schema')}`;
  const validate = ajv.getSchema(ref) ?? ajv.compile({ $ref: ref });
  const valid = validate(res.body);
  expect({ operation: `${method} ${path} → ${res.status}`, errors: valid ? null : validate.errors }).toEqual({
    operation: `${method} ${path} → ${res.status}`,
    errors: null,
  });
}

test('the document is valid OpenAPI 3.1', async () => {
  expect(doc.openapi).toBe('3.1.0');
  // The OpenAPI Initiative's published 3.1 schema, as @apidevtools/swagger-parser applies it, and its refs resolve.
  await expect(SwaggerParser.validate(structuredClone(doc) as never)).resolves.toBeDefined();
  // The validator does refuse a broken document (OpenAPI 3.1.0 §4.8.1: `info` is required).
  const broken = structuredClone(doc) as Partial<Doc> & { info?: unknown };
  delete broken.info;
  await expect(SwaggerParser.validate(broken as never)).rejects.toThrow();
});

test('every route the app mounts is documented with its method, and nothing the app lacks is', async () => {
  const routes = appRoutes(JSON.parse(process.env.TACTUS_TEST_SERVER_ENV!));
  const documented = documentedOperations(doc);
  // better-auth's handler is one catch-all route; the document lists the endpoints of it the app uses.
  const wildcards = routes.filter((r) => toOpenApiPath(r.path) === null);
  expect(wildcards).toEqual([{ method: 'ALL', path: '/api/auth/{*splat}' }]);
  const ours = routes.filter((r) => toOpenApiPath(r.path) !== null).map((r) => `${r.method} ${toOpenApiPath(r.path)}`);
  expect(ours.length).toBeGreaterThan(25);
  expect(documented.filter((o) => !o.includes(' /api/auth/')).sort()).toEqual([...ours].sort());

  // Each documented better-auth endpoint exists there: better-auth answers an unknown one with 404.
  const authOps = documented.filter((o) => o.includes(' /api/auth/'));
  expect(authOps.length).toBeGreaterThanOrEqual(5);
  await request(baseUrl).post('/api/auth/no-such-endpoint').set('Origin', baseUrl).send({}).expect(404);
  for (const op of authOps) {
    const [method, path] = op.split(' ') as [string, string];
    const res = await request(baseUrl)
      [method.toLowerCase() as 'get'](path)
      .set('Origin', baseUrl)
      .send(method === 'GET' ? undefined : {});
    expect({ op, status: res.status }).not.toEqual({ op, status: 404 });
  }
});

/** A documented path with its parameters filled by ids that exist nowhere. */
const concrete = (path: string) => path.replace(/\{(\w+)\}/g, 'no-such-$1');

test('the session cookie and role requirements are as documented, and every refusal is a documented error', async () => {
  const player = await signedInUser('openapi-roles');
  const ops = documentedOperations(doc).filter((o) => !o.includes(' /api/auth/'));
  for (const op of ops) {
    const [METHOD, path] = op.split(' ') as [string, string];
    const method = METHOD.toLowerCase();
    const operation = doc.paths[path]![method]!;
    const call = (r: ReturnType<typeof request>) =>
      r[method as 'get'](concrete(path))
        .redirects(1)
        .send(method === 'get' ? undefined : {});

    const anonymous = await call(request(baseUrl));
    expect({ op, needsSession: anonymous.status === 401 }).toEqual({ op, needsSession: !!operation.security?.length });
    expectDocumented(method, path, anonymous);

    // Signed in as a player: 403 exactly where a role is named that a player does not have.
    const roles = operation['x-roles'];
    const asPlayer = await call(player.agent);
    expect({ op, forbidden: asPlayer.status === 403 }).toEqual({ op, forbidden: !!roles && !roles.includes('player') });
    expect(asPlayer.status).not.toBe(401);
    expectDocumented(method, path, asPlayer);
  }
});

test('the documented session cookie is the one sign-in sets', async () => {
  const { email } = await signedInUser('openapi-cookie');
  const scheme = doc.components.securitySchemes.sessionCookie!;
  expect(scheme).toMatchObject({ type: 'apiKey', in: 'cookie' });
  const res = await agent().post('/api/auth/sign-in/email').send({ email, password: PASSWORD }).expect(200);
  const cookies = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  expect(cookies.some((c) => c.startsWith(`${scheme.name}=`))).toBe(true);
});

test('real responses of a signed-in player fit the documented schemas', async () => {
  const { agent: a } = await signedInUser('openapi-shapes');
  expectDocumented('get', '/api/me', await a.get('/api/me'));
  expectDocumented('get', '/api/health', await a.get('/api/health'));

  const created = await a
    .post('/api/songs')
    .send({ title: 'Étude in 7/8', composer: 'Test', meter: '7/8', goalBpm: 132 });
  expect(created.status).toBe(201);
  expectDocumented('post', '/api/songs', created);
  const id = created.body.id as string;

  const list = await a.get('/api/songs').expect(200);
  expect(list.body.songs).toHaveLength(1);
  expectDocumented('get', '/api/songs', list);
  // The check can fail: a song whose title is a number does not fit SongList.
  const wrong = { ...list, body: { songs: [{ ...list.body.songs[0], title: 42 }] } } as request.Response;
  expect(() => expectDocumented('get', '/api/songs', wrong)).toThrow();

  expectDocumented('get', '/api/songs/{id}', await a.get(`/api/songs/${id}`));
  expectDocumented('patch', '/api/songs/{id}', await a.patch(`/api/songs/${id}`).send({ workingBpm: 96 }));
  expectDocumented('patch', '/api/songs/{id}', await a.patch(`/api/songs/${id}`).send({ workingBpm: 12 })); // 400, below 30 BPM
  expectDocumented('get', '/api/songs/{songId}/recordings', await a.get(`/api/songs/${id}/recordings`));

  const candidate = await a.post(`/api/songs/${id}/candidates`).send({ bpm: 126, rating: 4, note: 'steady' });
  expect(candidate.status).toBe(201);
  expectDocumented('post', '/api/songs/{songId}/candidates', candidate);
  expectDocumented('get', '/api/songs/{songId}/candidates', await a.get(`/api/songs/${id}/candidates`));
  expectDocumented(
    'patch',
    '/api/candidates/{id}',
    await a.patch(`/api/candidates/${candidate.body.id}`).send({ rating: 5 }),
  );
  expectDocumented(
    'post',
    '/api/songs/{songId}/choose',
    await a.post(`/api/songs/${id}/choose`).send({ bpm: 126, note: 'the bow holds' }),
  );

  const entry = await a
    .post(`/api/songs/${id}/practice`)
    .send({ passage: 'bars 9–16', startBpm: 100, reachedBpm: 116, repetitions: 12, minutes: 20, clean: true });
  expect(entry.status).toBe(201);
  expectDocumented('post', '/api/songs/{songId}/practice', entry);
  const log = await a.get(`/api/songs/${id}/practice`).expect(200);
  expect(log.body.entries).toHaveLength(1);
  expectDocumented('get', '/api/songs/{songId}/practice', log);

  expectDocumented('delete', '/api/candidates/{id}', await a.delete(`/api/candidates/${candidate.body.id}`));
  expectDocumented('delete', '/api/songs/{id}', await a.delete(`/api/songs/${id}`));
});

test('the reference page is served in development with its scripts from this server', async () => {
  await request(baseUrl).get('/api/docs').expect(301).expect('location', '/api/docs/');
  const page = await request(baseUrl).get('/api/docs/').expect(200).expect('content-type', /html/);
  for (const asset of ['swagger-ui.css', 'swagger-ui-bundle.js', 'swagger-ui-init.js']) {
    expect(page.text).toContain(`./${asset}`);
    await request(baseUrl).get(`/api/docs/${asset}`).expect(200);
  }
  // The page's set-up script carries this document.
  const init = await request(baseUrl).get('/api/docs/swagger-ui-init.js').expect(200);
  expect(init.text).toContain('"title": "Tactus API"');
});
