// The Redis connection, opened only when RATE_LIMIT_STORE=redis (its only user, the shared
// rate-limit buckets). Made to fail fast: no offline queue and no retried commands, so a call
// that cannot reach Redis gets its 503 at once instead of waiting for a reconnect; the client
// itself keeps reconnecting in the background. Closed at shutdown.
import {
  Global,
  Inject,
  Injectable,
  Logger,
  Module,
  OnApplicationBootstrap,
  OnApplicationShutdown,
} from '@nestjs/common';
import { Redis } from 'ioredis';
import { APP_CONFIG, AppConfig } from '../config/config.js';

export const REDIS = Symbol('REDIS');

export function createRedis(url: string): Redis {
  const client = new Redis(url, {
    connectTimeout: 1000,
    commandTimeout: 1000,
    enableOfflineQueue: false,
    maxRetriesPerRequest: 0,
    // Reconnect soon after an outage ends (at most 1 s between attempts), forever.
    retryStrategy: (times) => Math.min(100 * times, 1000),
    connectionName: 'lumenwright-rate-limits',
  });
  return client;
}

@Injectable()
export class RedisLifecycle implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly log = new Logger('Redis');
  private down = false;

  constructor(@Inject(REDIS) private readonly client: Redis | null) {
    // Without a listener ioredis prints every failed attempt; report transitions instead.
    client?.on('error', (err: Error) => {
      if (this.down) return;
      this.down = true;
      this.log.warn(`Redis unreachable (${err.message}); rate-limited calls answer 503`);
    });
    client?.on('ready', () => {
      if (!this.down) return;
      this.down = false;
      this.log.log('Redis reachable again');
    });
  }

  /** Gives the first connection a moment, so the first calls after boot find it ready. */
  async onApplicationBootstrap(): Promise<void> {
    const c = this.client;
    if (!c || c.status === 'ready') return;
    await new Promise<void>((resolve) => {
      const done = () => {
        clearTimeout(timer);
        c.off('ready', done);
        resolve();
      };
      const timer = setTimeout(done, 2000);
      c.once('ready', done);
    });
  }

  async onApplicationShutdown(): Promise<void> {
    const c = this.client;
    if (!c || c.status === 'end') return;
    const ended = new Promise<void>((resolve) => c.once('end', resolve));
    // QUIT when connected; when Redis is unreachable it fails at once and we just disconnect.
    await c.quit().catch(() => c.disconnect());
    let timer: NodeJS.Timeout | undefined;
    await Promise.race([ended, new Promise((r) => (timer = setTimeout(r, 1000)))]);
    clearTimeout(timer);
  }
}

@Global()
@Module({
  providers: [
    {
      provide: REDIS,
      inject: [APP_CONFIG],
      useFactory: (config: AppConfig) =>
        config.rateLimitStore === 'redis' && config.redisUrl ? createRedis(config.redisUrl) : null,
    },
    RedisLifecycle,
  ],
  exports: [REDIS],
})
export class RedisModule {}
