// Which failures of PostgreSQL and Redis become a retryable 503, and which stay a 500 (a bug of
// ours the store answered): classified on errors raised by a real PostgreSQL 15 and a real
// redis-server, not on hand-made objects. SQLSTATE meanings: PostgreSQL manual, Appendix A;
// Redis error prefixes: Redis documentation, "Errors".
import { Redis } from 'ioredis';
import pg from 'pg';
import { DomainError } from '../../src/common/errors/domain-error.js';
import {
  isDatabaseUnavailable,
  isTransientDependencyError,
} from '../../src/common/errors/transient.js';
import { dependencyUnavailable } from '../../src/plans/plans.service.js';
import { freePort, throwawayRedis, type ThrowawayRedis } from '../factories/ops.js';
import { testDatabaseUrl } from '../setup/db.js';

const failure = async (p: Promise<unknown>): Promise<unknown> => {
  try {
    await p;
  } catch (e) {
    return e;
  }
  throw new Error('expected a failure');
};

describe('dependency errors: retry (503) or bug (500)', () => {
  let redis: ThrowawayRedis;
  beforeAll(async () => {
    redis = await throwawayRedis();
    redis.start();
  });
  afterAll(() => redis?.remove());

  it('PostgreSQL: a bad query is a bug; a refused connection and an admin shutdown are transient', async () => {
    const pool = new pg.Pool({ connectionString: testDatabaseUrl(), max: 2 });
    try {
      const syntax = await failure(pool.query('SELEC 1')); // 42601 syntax_error
      const divide = await failure(pool.query('SELECT 1/0')); // 22012 division_by_zero
      expect((syntax as { code: string }).code).toBe('42601');
      expect((divide as { code: string }).code).toBe('22012');
      for (const bug of [syntax, divide]) {
        expect(isTransientDependencyError(bug)).toBe(false);
        expect(isDatabaseUnavailable(bug)).toBe(false);
        // Stays itself: the problem filter turns it into a logged 500.
        expect(dependencyUnavailable('The database')(bug)).toBe(bug);
      }
      // 57P01 admin_shutdown: the server ended our session (as in a restart or failover).
      const victim = await pool.connect();
      const [{ pid }] = (await victim.query('SELECT pg_backend_pid() AS pid')).rows;
      victim.on('error', () => undefined);
      const killed = failure(victim.query('SELECT pg_sleep(5)'));
      await pool.query('SELECT pg_terminate_backend($1)', [pid]);
      const shutdown = await killed;
      victim.release(true);
      expect((shutdown as { code?: string }).code).toBe('57P01');
      expect(isTransientDependencyError(shutdown)).toBe(true);
      expect(isDatabaseUnavailable(shutdown)).toBe(true);
    } finally {
      await pool.end();
    }
    const closed = await freePort(); // nothing listens there
    const refused = await failure(
      new pg.Client({ connectionString: `postgres://x:y@127.0.0.1:${closed}/z` }).connect(),
    );
    expect(isTransientDependencyError(refused)).toBe(true);
    expect(isDatabaseUnavailable(refused)).toBe(true);
    const mapped = dependencyUnavailable('The database')(refused);
    expect(mapped).toBeInstanceOf(DomainError);
    expect((mapped as DomainError).code).toBe('unavailable');
  });

  it('Redis: a script error is a bug; a closed connection is transient', async () => {
    const client = new Redis(redis.url, { maxRetriesPerRequest: 0, lazyConnect: true });
    await client.connect();
    try {
      const script = await failure(client.eval('return redis.call("NOPE")', 0));
      expect((script as Error).name).toBe('ReplyError');
      expect(isTransientDependencyError(script)).toBe(false);
      expect(dependencyUnavailable('Redis')(script)).toBe(script);
      const wrongType = await failure(
        client.set('lw:test:s', 'x').then(() => client.incr('lw:test:s')),
      );
      expect(isTransientDependencyError(wrongType)).toBe(false);
    } finally {
      client.disconnect();
    }
    const down = new Redis(redis.url, {
      maxRetriesPerRequest: 0,
      enableOfflineQueue: false,
      lazyConnect: true,
    });
    const closed = await failure(down.get('x')); // never connected: the stream is not writable
    expect(isTransientDependencyError(closed)).toBe(true);
    expect(dependencyUnavailable('Redis')(closed)).toBeInstanceOf(DomainError);
    down.disconnect();
  });
});
