// Is a failure of a dependency (PostgreSQL, Redis) worth a retry? Connection trouble and the
// store's own "busy, try again" answers are: the caller gets a 503 with Retry-After. An answer
// that says our request was wrong (an SQL or script error, a constraint, a wrong type) is a bug
// on our side: it stays a 500, logged, instead of inviting clients to retry forever.

const NETWORK_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ECONNABORTED',
  'ETIMEDOUT',
  'EPIPE',
  'ENOTFOUND',
  'EHOSTUNREACH',
  'ENETUNREACH',
  'EAI_AGAIN',
]);

// SQLSTATE classes and codes that mean "not now" (PostgreSQL manual, Appendix A): 08 connection
// exception, 53 insufficient resources, 57P01-57P03 shutdown / cannot connect now, 40001
// serialization failure, 40P01 deadlock, 55P03 lock not available.
const TRANSIENT_SQLSTATE_CLASSES = ['08', '53'];
const TRANSIENT_SQLSTATES = new Set(['57P01', '57P02', '57P03', '40001', '40P01', '55P03']);

// Redis error prefixes that mean "not now" (Redis documentation, error replies).
const TRANSIENT_REDIS_PREFIXES = [
  'LOADING',
  'BUSY',
  'OOM',
  'MASTERDOWN',
  'READONLY',
  'TRYAGAIN',
  'CLUSTERDOWN',
];

const DB_DOWN_MESSAGE =
  /Connection terminated|connect ECONNREFUSED|timeout exceeded when trying to connect|Connection is not established|terminating connection|Client has encountered a connection error/i;

const isTransientSqlState = (code: string) =>
  TRANSIENT_SQLSTATES.has(code) || TRANSIENT_SQLSTATE_CLASSES.includes(code.slice(0, 2));

/**
 * True when the error means PostgreSQL can't be reached right now (not a bad query). Positive
 * matches only: the problem filter uses it on any error, most of which are not about the database.
 */
export function isDatabaseUnavailable(err: unknown, depth = 0): boolean {
  if (!err || typeof err !== 'object' || depth > 3) return false;
  const e = err as { code?: unknown; message?: unknown; driverError?: unknown; cause?: unknown };
  const code = typeof e.code === 'string' ? e.code : '';
  if (NETWORK_CODES.has(code) || (/^[0-9A-Z]{5}$/.test(code) && isTransientSqlState(code))) {
    return true;
  }
  if (typeof e.message === 'string' && DB_DOWN_MESSAGE.test(e.message)) return true;
  return (
    isDatabaseUnavailable(e.driverError, depth + 1) || isDatabaseUnavailable(e.cause, depth + 1)
  );
}

interface ErrorLike {
  name?: unknown;
  code?: unknown;
  message?: unknown;
  driverError?: unknown;
}

/**
 * For an error from a call to a store (PostgreSQL, Redis): true unless the store answered that
 * the request itself was wrong. Only used where the error is known to come from such a call.
 */
export function isTransientDependencyError(err: unknown): boolean {
  if (!err || typeof err !== 'object') return true;
  const e = err as ErrorLike;
  // TypeORM wraps the driver's error.
  if (e.driverError && e.driverError !== err) return isTransientDependencyError(e.driverError);
  const code = typeof e.code === 'string' ? e.code : '';
  const message = typeof e.message === 'string' ? e.message : '';
  if (NETWORK_CODES.has(code)) return true;
  // A PostgreSQL answer: transient only for the "not now" states.
  if (/^[0-9A-Z]{5}$/.test(code)) return isTransientSqlState(code);
  if (e.name === 'ReplyError') {
    // Redis answered: transient only when it says it is busy, loading, out of memory…
    return TRANSIENT_REDIS_PREFIXES.some((p) => message.startsWith(p));
  }
  // No answer from the store at all (closed connection, pool timeout, retries exhausted).
  return true;
}
