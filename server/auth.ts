// Sign-in, sessions, e-mail verification and password reset (better-auth), stored through Sequelize.
import { betterAuth } from 'better-auth';
import { config } from './config';
import { sequelizeAdapter } from './auth-adapter';
import { log } from './log';
import { linkMail, sendMail } from '@/server/mail/mailer';

const deliver = (mail: Parameters<typeof sendMail>[0]) => {
  // better-auth waits for these hooks; sending in the background keeps sign-up fast, and a failure is logged.
  sendMail(mail).catch((err) => log.error({ err }, 'could not send mail'));
};

export const auth = betterAuth({
  appName: 'Tactus',
  baseURL: config.publicUrl,
  basePath: '/api/auth',
  secret: config.authSecret,
  trustedOrigins: config.trustedOrigins,
  database: sequelizeAdapter(),
  telemetry: { enabled: false },
  user: {
    modelName: 'users',
    additionalFields: {
      // Never settable by the user at sign-up: an admin changes it through /api/admin/users/:id/role.
      role: { type: 'string', required: false, defaultValue: 'player', input: false },
    },
  },
  session: { modelName: 'sessions' },
  account: { modelName: 'accounts' },
  verification: { modelName: 'verifications' },
  emailAndPassword: {
    enabled: true,
    requireEmailVerification: true,
    minPasswordLength: 8,
    maxPasswordLength: 128,
    resetPasswordTokenExpiresIn: 60 * 60,
    sendResetPassword: async ({ user, url }) =>
      deliver(
        linkMail(
          user.email,
          'Reset your Tactus password',
          `Hello ${user.name},`,
          'Someone asked to reset the password of your Tactus account. The link works for one hour.',
          'Choose a new password',
          url,
        ),
      ),
  },
  emailVerification: {
    sendOnSignUp: true,
    sendOnSignIn: true,
    autoSignInAfterVerification: false,
    expiresIn: 24 * 60 * 60,
    sendVerificationEmail: async ({ user, url }) =>
      deliver(
        linkMail(
          user.email,
          'Confirm your e-mail for Tactus',
          `Hello ${user.name},`,
          'Welcome to Tactus. Confirm this address to start keeping your songs, takes and tempos.',
          'Confirm my e-mail',
          url,
        ),
      ),
  },
  // Our own limits (server/rate-limit.ts) count in the database, in every mode and across processes;
  // better-auth's would count per process, and only in production.
  rateLimit: { enabled: false },
  advanced: { useSecureCookies: config.secureCookies },
});
