// Sign-in actions over better-auth's HTTP endpoints (mounted by the server at /api/auth).
import { apiFetch, ApiRequestError } from './api';
import { AUTH_MESSAGES } from '@/shared/messages';

async function call(path: string, body: unknown) {
  try {
    return await apiFetch<unknown>(`/api/auth${path}`, { body });
  } catch (err) {
    if (err instanceof ApiRequestError && err.code && AUTH_MESSAGES[err.code]) {
      throw new ApiRequestError(err.status, AUTH_MESSAGES[err.code]!, err.field, err.code);
    }
    throw err;
  }
}

/** Only a path of this app (never another site) is followed after signing in. */
export const safeNext = (next: string | undefined | null) =>
  next && next.startsWith('/') && !next.startsWith('//') ? next : null;

/** `next`: where to go after the e-mail is confirmed and the person signs in (an invitation, say). */
export const signUp = (name: string, email: string, password: string, next?: string | null) =>
  call('/sign-up/email', {
    name,
    email,
    password,
    callbackURL: `/sign-in?confirmed=1${safeNext(next) ? `&next=${encodeURIComponent(next!)}` : ''}`,
  });
export const signIn = (email: string, password: string) =>
  call('/sign-in/email', { email, password, callbackURL: '/sign-in?confirmed=1' });
export const signOut = () => call('/sign-out', {});
export const requestPasswordReset = (email: string) =>
  call('/request-password-reset', { email, redirectTo: '/reset-password' });
export const resetPassword = (token: string, newPassword: string) => call('/reset-password', { token, newPassword });
