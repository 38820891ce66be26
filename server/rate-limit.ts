// Rate limits shared by every server process: rate-limiter-flexible's MySQL store, counting in the
// `rate_limits` table (migration 0016) over the server's own Sequelize connections.
import { createHash } from 'node:crypto';
import type { RequestHandler, Request } from 'express';
import { RateLimiterMySQL, RateLimiterRes } from 'rate-limiter-flexible';
import { config } from './config';
import { sequelize } from './db';
import { TooManyRequests } from './http';
import { log } from './log';
import { plural } from '@/shared/format';

type Callback = (err: Error | null, result?: unknown) => void;
type DriverConnection = {
  query(sql: string, values?: unknown[]): Promise<unknown>;
  escapeId(name: string): string;
};

/**
 * The store speaks the callback dialect of the `mysql` driver (`conn.query(sql, values, cb)`, `??` for
 * identifiers); ours is the promise-based `mariadb` driver behind Sequelize. This wraps one pooled connection
 * in that dialect, so each counter's BEGIN … COMMIT runs on a single connection.
 */
class CallbackConnection {
  constructor(private readonly conn: DriverConnection) {}

  query(sql: string, values: unknown[] | Callback, cb?: Callback) {
    const done = (typeof values === 'function' ? values : cb) ?? (() => {});
    const params = typeof values === 'function' ? [] : [...values];
    const kept: unknown[] = [];
    // `??` takes an identifier from the values; `?` stays a placeholder for the driver.
    const text = sql.replace(/\?\?|\?/g, (mark) => {
      const value = params.shift();
      if (mark === '??') return this.conn.escapeId(String(value));
      kept.push(value);
      return '?';
    });
    this.conn.query(text, kept).then(
      (rows) => done(null, Array.isArray(rows) ? rows.map(numbersOnly) : rows),
      (err: Error) => done(err),
    );
  }

  rollback() {
    this.conn.query('ROLLBACK').catch(() => {});
  }

  release() {
    void sequelize.connectionManager.releaseConnection(this.conn as never);
  }
}

/** `expire` is a BIGINT, which the driver hands back as a bigint; the store does arithmetic on numbers. */
const numbersOnly = (row: Record<string, unknown>) =>
  Object.fromEntries(Object.entries(row).map(([k, v]) => [k, typeof v === 'bigint' ? Number(v) : v]));

const pool = {
  getConnection(cb: (err: Error | null, conn?: CallbackConnection) => void) {
    sequelize.connectionManager
      .getConnection({ type: 'write' })
      .then((conn) => cb(null, new CallbackConnection(conn as unknown as DriverConnection)), cb);
  },
};

export type LimitName = keyof typeof config.rateLimits;

const limiters = new Map<LimitName, RateLimiterMySQL>();
function limiter(name: LimitName): RateLimiterMySQL {
  let found = limiters.get(name);
  if (!found) {
    const { points, seconds } = config.rateLimits[name];
    found = new RateLimiterMySQL({
      storeClient: pool,
      storeType: 'pool',
      dbName: config.db.name,
      tableName: 'rate_limits',
      tableCreated: true, // the migration made it
      keyPrefix: name,
      points,
      duration: seconds,
    });
    limiters.set(name, found);
  }
  return found;
}

/** Account names (e-mail addresses) are kept in the table only as a digest. */
export const digest = (text: string) =>
  createHash('sha256').update(text.trim().toLowerCase()).digest('hex').slice(0, 32);

const waitWords = (ms: number) =>
  ms < 60_000 ? plural(Math.max(1, Math.ceil(ms / 1000)), 'second') : plural(Math.ceil(ms / 60_000), 'minute');

/** "Too many … Try again in 15 minutes[, or …]." */
const refusal = (what: string, ms: number, otherwise?: string) =>
  new TooManyRequests(
    `${what} Try again in ${waitWords(ms)}${otherwise ? `, or ${otherwise}` : ''}.`,
    Math.max(1, Math.ceil(ms / 1000)),
  );

/**
 * Counts one request against `name` for `key`; past the limit, a 429 saying when to try again. A store that
 * cannot be reached lets the request through (and says so in the log): the database it lives in is the one
 * every request needs anyway.
 */
export async function consume(name: LimitName, key: string, what: string, otherwise?: string): Promise<void> {
  try {
    await limiter(name).consume(key);
  } catch (err) {
    if (err instanceof RateLimiterRes) throw refusal(what, err.msBeforeNext, otherwise);
    log.warn({ err, limit: name }, 'rate limit store unavailable');
  }
}

export async function forget(name: LimitName, key: string): Promise<void> {
  await limiter(name)
    .delete(key)
    .catch((err: unknown) => log.warn({ err, limit: name }, 'rate limit store unavailable'));
}

/** Middleware: one request of this kind counted per key (`keyOf` the request); past the limit, 429. */
export const rateLimit =
  (name: LimitName, keyOf: (req: Request) => string, what: string): RequestHandler =>
  (req, _res, next) => {
    consume(name, keyOf(req), what).then(() => next(), next);
  };
