// Every setting the server reads from its environment, in one place, with the defaults the scripts use.
import path from 'node:path';

const root = process.env.TACTUS_ROOT ?? path.resolve(__dirname, '..');
const state = process.env.TACTUS_STATE ?? path.join(root, '.tactus');
const production = process.env.NODE_ENV === 'production';
const port = Number(process.env.TACTUS_PORT ?? 4610);
const publicUrl = process.env.TACTUS_PUBLIC_URL ?? `http://127.0.0.1:${port}`;
const num = (name: string, fallback: number) => Number(process.env[name] ?? fallback);

export const config = {
  root,
  production,
  /** The caught-mail page and other development helpers are never mounted in production. */
  devTools: !production || process.env.TACTUS_DEV_TOOLS === '1',
  port,
  publicUrl,
  authSecret: process.env.TACTUS_AUTH_SECRET ?? 'tactus-local-development-secret-change-me-in-production',
  /** Production refuses to start on the development secret (server/index.ts). */
  authSecretSet: Boolean(process.env.TACTUS_AUTH_SECRET),
  /** Origins whose pages may send state-changing requests: the app itself and the Expo dev server. */
  trustedOrigins: [
    new URL(publicUrl).origin,
    'http://localhost:8081',
    'http://127.0.0.1:8081',
    ...(process.env.TACTUS_TRUSTED_ORIGINS?.split(',').filter(Boolean) ?? []),
  ],
  /** Session cookies marked Secure: on when the public address is https, or TACTUS_SECURE_COOKIES=1. */
  secureCookies:
    process.env.TACTUS_SECURE_COOKIES === '1' ||
    (process.env.TACTUS_SECURE_COOKIES !== '0' && publicUrl.startsWith('https:')),
  /** Structured request logs (pino): level, and a file to write them to (default: standard output). */
  log: {
    level: process.env.TACTUS_LOG_LEVEL ?? 'info',
    file: process.env.TACTUS_LOG_FILE,
    /** Every this many ms, a line with the process's memory and event-loop delay (0: none; the benchmarks set it). */
    processStatsMs: num('TACTUS_PROCESS_STATS_MS', 0),
  },
  /** The largest JSON body any route reads, sign-in routes included (the server says 413 past it). */
  maxJsonBytes: num('TACTUS_MAX_JSON_BYTES', 1024 * 1024),
  /**
   * Rate limits, counted in the database so every server process shares them: `points` requests per
   * `seconds`. Sign-in failures are counted per account and address, the rest per address or per person.
   */
  rateLimits: {
    signInFailures: { points: num('TACTUS_RATE_SIGNIN_FAILURES', 10), seconds: num('TACTUS_RATE_SIGNIN_SECONDS', 900) },
    signInPerAddress: { points: num('TACTUS_RATE_SIGNIN_PER_ADDRESS', 100), seconds: 900 },
    signUp: { points: num('TACTUS_RATE_SIGNUPS', 20), seconds: num('TACTUS_RATE_SIGNUP_SECONDS', 3600) },
    mailPerAccount: { points: num('TACTUS_RATE_MAILS_PER_ACCOUNT', 5), seconds: 3600 },
    mailPerAddress: { points: num('TACTUS_RATE_MAILS_PER_ADDRESS', 20), seconds: 3600 },
    invitations: { points: num('TACTUS_RATE_INVITATIONS', 30), seconds: 3600 },
    uploads: { points: num('TACTUS_RATE_UPLOADS', 60), seconds: 3600 },
  },
  webDist: process.env.TACTUS_WEB_DIST ?? path.join(root, 'dist'),
  db: {
    host: process.env.TACTUS_DB_HOST ?? '127.0.0.1',
    port: Number(process.env.TACTUS_DB_PORT ?? 3406),
    user: process.env.TACTUS_DB_USER ?? 'tactus',
    password: process.env.TACTUS_DB_PASSWORD ?? 'tactus-local',
    name: process.env.TACTUS_DB_NAME ?? 'tactus_dev',
  },
  storage: {
    driver: (process.env.TACTUS_STORAGE ?? 'disk') as 'disk' | 's3',
    dir: process.env.TACTUS_STORAGE_DIR ?? path.join(state, 'recordings'),
    /** Uploads are spooled here while they are checked; never under a real name. */
    spoolDir: process.env.TACTUS_SPOOL_DIR ?? path.join(state, 'spool'),
    s3: {
      endpoint: process.env.TACTUS_S3_ENDPOINT ?? 'http://127.0.0.1:4569',
      bucket: process.env.TACTUS_S3_BUCKET ?? 'tactus-recordings',
      region: process.env.TACTUS_S3_REGION ?? 'us-east-1',
      accessKeyId: process.env.TACTUS_S3_ACCESS_KEY ?? 'S3RVER',
      secretAccessKey: process.env.TACTUS_S3_SECRET_KEY ?? 'S3RVER',
    },
  },
  /** How long a process remembers whom a session cookie belongs to (0: ask better-auth on every request). */
  sessionMemoMs: Number(process.env.TACTUS_SESSION_MEMO_MS ?? 5_000),
  uploads: {
    maxBytes: Number(process.env.TACTUS_MAX_UPLOAD_BYTES ?? 200 * 1024 * 1024),
    maxDurationSec: Number(process.env.TACTUS_MAX_DURATION_SEC ?? 20 * 60),
    /** Uploads checked at once (each in a worker thread, one ffmpeg each); the rest wait in line. */
    concurrentChecks: Number(process.env.TACTUS_CONCURRENT_CHECKS ?? 2),
    /** Past this many waiting, an upload is refused as busy (503) instead of queued. */
    maxWaitingChecks: Number(process.env.TACTUS_MAX_WAITING_CHECKS ?? 100),
    /** A check that takes longer is stopped and the upload refused (a capped decode of 20 minutes takes ~3 s). */
    checkTimeoutMs: Number(process.env.TACTUS_CHECK_TIMEOUT_MS ?? 60_000),
  },
  analysis: {
    /** Worker threads per server process; default: one per core but one, at least one. */
    workers: Number(process.env.TACTUS_ANALYSIS_WORKERS ?? 0),
    /** A running job whose heartbeat is older than this is taken to be orphaned (its process died). */
    staleAfterMs: Number(process.env.TACTUS_JOB_STALE_MS ?? 15_000),
    maxAttempts: 3,
  },
  digests: {
    /** Notes written within this of each other go out in one mail (the first waits this long). */
    gatherMs: Number(process.env.TACTUS_DIGEST_GATHER_MS ?? 2 * 60_000),
    /** At most one digest per player in this time (the teachers issue: 15 minutes). */
    minGapMs: Number(process.env.TACTUS_DIGEST_GAP_MS ?? 15 * 60_000),
    /** How often each process looks for digests that are due. */
    pollMs: Number(process.env.TACTUS_DIGEST_POLL_MS ?? 60_000),
  },
  mail: {
    host: '127.0.0.1',
    port: Number(process.env.TACTUS_SMTP_PORT ?? 2526),
    from: process.env.TACTUS_MAIL_FROM ?? 'Tactus <hello@tactus.local>',
    caughtDir: process.env.TACTUS_MAIL_DIR ?? path.join(state, 'mail'),
  },
};
