// Sign-in actions over better-auth's HTTP endpoints (mounted by the server at /api/auth).
import { apiFetch, ApiRequestError } from './api';

/** better-auth's codes → what we tell a musician. */
const friendly: Record<string, string> = {
  INVALID_EMAIL_OR_PASSWORD: 'That e-mail and password do not match an account.',
  EMAIL_NOT_VERIFIED: 'Confirm your e-mail first: we have sent you a new link.',
  USER_ALREADY_EXISTS: 'An account with this e-mail already exists. Sign in instead.',
  USER_ALREADY_EXISTS_USE_ANOTHER_EMAIL: 'An account with this e-mail already exists. Sign in instead.',
  PASSWORD_TOO_SHORT: 'Use at least 8 characters for your password.',
  INVALID_TOKEN: 'This link has expired or was already used. Ask for a new one.',
};

async function call(path: string, body: unknown) {
  try {
    return await apiFetch<unknown>(`/api/auth${path}`, { body });
  } catch (err) {
    if (err instanceof ApiRequestError && err.code && friendly[err.code]) {
      throw new ApiRequestError(err.status, friendly[err.code]!, err.field, err.code);
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
