// The app's own list of its API routes, read from Express's routers (not written by hand), for the OpenAPI
// check and the authorization matrix. Uses router 2.3's public `listRoutes()`, which gives each layer's
// path as it was written, mount prefixes included.
import { METHODS } from 'node:http';
import type { Express } from 'express';

/** One method on one path. `path` is Express 5 syntax (`/api/songs/:id`); `method` is upper case, or `ALL` for `app.all`. */
export interface RouteEntry {
  method: string;
  path: string;
}

/** What router 2.3's `listRoutes()` returns (the router's own types are not the ones @types/express exposes). */
interface ListedRoute {
  path: string | RegExp;
  methods: string[] | undefined;
  router: RouterWithList | undefined;
}
interface RouterWithList {
  listRoutes?: () => ListedRoute[];
}

/** Express answers HEAD with the GET handler by itself, so a HEAD next to a GET is not a route of its own. */
const AUTOMATIC_HEAD = 'HEAD';
/** `app.all()` registers every method Node knows (express/lib/application.js); listed as one `ALL` entry. */
const ALL = 'ALL';

export function joinPath(prefix: string, path: string): string {
  if (path === '/' || path === '') return prefix === '' ? '/' : prefix;
  return (prefix === '/' ? '' : prefix) + path;
}

function walk(router: RouterWithList, prefix: string, out: RouteEntry[]) {
  if (typeof router.listRoutes !== 'function') {
    // Without it the mount prefixes cannot be recovered; failing loudly beats an incomplete list.
    throw new Error('listRoutes needs router >= 2.3 (express 5), whose routers have listRoutes()');
  }
  for (const entry of router.listRoutes()) {
    if (typeof entry.path !== 'string')
      throw new Error(`a route is mounted on a RegExp (${String(entry.path)}): give it a path string`);
    const path = joinPath(prefix, entry.path);
    if (entry.router) {
      walk(entry.router, path, out);
      continue;
    }
    const methods = entry.methods ?? [];
    if (METHODS.every((m) => methods.includes(m))) {
      out.push({ method: ALL, path });
      continue;
    }
    for (const method of methods) {
      if (method === AUTOMATIC_HEAD && methods.includes('GET')) continue;
      out.push({ method, path });
    }
  }
}

/** Every route the app answers under `/api`, in the order the app matches them. */
export function listRoutes(app: Express, under = '/api'): RouteEntry[] {
  const out: RouteEntry[] = [];
  walk(app.router as unknown as RouterWithList, '', out);
  return out.filter((r) => r.path === under || r.path.startsWith(`${under}/`));
}

/** `/api/songs/:id` → `/api/songs/{id}` (OpenAPI path templating). Wildcards (`*splat`) have no OpenAPI form: null. */
export function toOpenApiPath(path: string): string | null {
  if (/[*{}()?]/.test(path)) return null;
  return path.replace(/:(\w+)/g, '{$1}');
}
