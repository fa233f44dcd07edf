import { Module } from '@nestjs/common';
import type { Redis } from 'ioredis';
import type pg from 'pg';
import { APP_CONFIG, AppConfig } from '../config/config.js';
import { REDIS } from '../redis/redis.module.js';
import { UsageModule } from '../usage/usage.module.js';
import { USAGE_POOL } from '../usage/usage-writer.service.js';
import { KeyReadGuard, MeteredCallGuard } from './metered-call.guard.js';
import { PlansController } from './plans.controller.js';
import { PlansService } from './plans.service.js';
import { QuotaService } from './quota.service.js';
import {
  MemoryRateLimitStorage,
  PostgresRateLimitStorage,
  RATE_LIMIT_STORAGE,
  RedisRateLimitStorage,
} from './rate-limit.storage.js';

@Module({
  imports: [UsageModule],
  controllers: [PlansController],
  providers: [
    PlansService,
    QuotaService,
    MeteredCallGuard,
    KeyReadGuard,
    {
      provide: RATE_LIMIT_STORAGE,
      inject: [APP_CONFIG, USAGE_POOL, REDIS],
      useFactory: (config: AppConfig, pool: pg.Pool, redis: Redis | null) => {
        if (config.rateLimitStore === 'redis' && redis) return new RedisRateLimitStorage(redis);
        if (config.rateLimitStore === 'postgres') return new PostgresRateLimitStorage(pool);
        return new MemoryRateLimitStorage();
      },
    },
  ],
  exports: [
    PlansService,
    QuotaService,
    MeteredCallGuard,
    KeyReadGuard,
    RATE_LIMIT_STORAGE,
    UsageModule,
  ],
})
export class PlansModule {}
