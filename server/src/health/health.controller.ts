import { Controller, Get, Inject } from '@nestjs/common';
import {
  ApiOkResponse,
  ApiOperation,
  ApiServiceUnavailableResponse,
  ApiTags,
} from '@nestjs/swagger';
import {
  HealthCheck,
  HealthCheckService,
  HealthIndicatorService,
  TypeOrmHealthIndicator,
} from '@nestjs/terminus';
import type { Redis } from 'ioredis';
import { Public } from '../common/decorators/access.decorator.js';
import { REDIS } from '../redis/redis.module.js';

@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(
    private readonly health: HealthCheckService,
    private readonly db: TypeOrmHealthIndicator,
    private readonly indicators: HealthIndicatorService,
    // Present only when the rate limits live in Redis (RATE_LIMIT_STORE=redis).
    @Inject(REDIS) private readonly redis: Redis | null,
  ) {}

  @Get()
  @Public()
  @HealthCheck()
  @ApiOperation({
    summary: 'Service health: the API, its database and, when it is the rate-limit store, Redis.',
  })
  @ApiOkResponse({ description: 'Everything is up.' })
  @ApiServiceUnavailableResponse({ description: 'A dependency (the database) is down.' })
  getHealth() {
    const redis = this.redis;
    return this.health.check([
      () => this.db.pingCheck('database', { timeout: 1500 }),
      ...(redis ? [() => this.pingRedis(redis)] : []),
    ]);
  }

  /** The client fails fast (no offline queue, 1 s command timeout), so this never hangs. */
  private async pingRedis(redis: Redis) {
    const check = this.indicators.check('redis');
    try {
      await redis.ping();
      return check.up();
    } catch (err) {
      return check.down({ message: err instanceof Error ? err.message : String(err) });
    }
  }
}
