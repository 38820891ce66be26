// The one place the client talks HTTP. Same origin as the server; cookies carry the session.
import { ApiErrorSchema } from '@/shared/schemas';
import { plainProblem } from '@/shared/messages';

/** Where the API lives: the same origin in the web build, overridable for the dev server. */
export const apiBase = (process.env.EXPO_PUBLIC_API_URL ?? '').replace(/\/$/, '');

/** A refused or failed request; its message is in plain words, with the field named as the screen names it. */
export class ApiRequestError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly field?: string,
    readonly code?: string,
  ) {
    super(plainProblem(message, field));
  }
}

export async function apiFetch<T>(path: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
  const res = await fetch(`${apiBase}${path}`, {
    method: init.method ?? (init.body === undefined ? 'GET' : 'POST'),
    credentials: 'include',
    headers: init.body === undefined ? undefined : { 'content-type': 'application/json' },
    body: init.body === undefined ? undefined : JSON.stringify(init.body),
  });
  if (res.status === 204) return undefined as T;
  const data = await res.json().catch(() => null);
  if (!res.ok) {
    // Our API answers { error: {...} }; better-auth answers { message, code }.
    const ours = ApiErrorSchema.safeParse(data);
    if (ours.success)
      throw new ApiRequestError(res.status, ours.data.error.message, ours.data.error.field, ours.data.error.code);
    const message = (data && typeof data.message === 'string' && data.message) || `request failed (${res.status})`;
    throw new ApiRequestError(res.status, message, undefined, data?.code);
  }
  return data as T;
}

export const fetcher = <T>(path: string) => apiFetch<T>(path);
