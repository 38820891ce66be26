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

export const signUp = (name: string, email: string, password: string) =>
  call('/sign-up/email', { name, email, password, callbackURL: '/sign-in?confirmed=1' });
export const signIn = (email: string, password: string) =>
  call('/sign-in/email', { email, password, callbackURL: '/sign-in?confirmed=1' });
export const signOut = () => call('/sign-out', {});
export const requestPasswordReset = (email: string) => call('/request-password-reset', { email, redirectTo: '/reset-password' });
export const resetPassword = (token: string, newPassword: string) => call('/reset-password', { token, newPassword });
