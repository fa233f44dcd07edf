import { DynamicModule, Module } from '@nestjs/common';
import { APP_FILTER, APP_GUARD } from '@nestjs/core';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AccessGuard } from './common/guards/access.guard.js';
import { ProblemFilter } from './common/filters/problem.filter.js';
import { AppConfig } from './config/config.js';
import { ConfigModule } from './config/config.module.js';
import { typeormOptions } from './database/typeorm.options.js';
import { HealthModule } from './health/health.module.js';
import { RedisModule } from './redis/redis.module.js';
import { FEATURE_MODULES } from './features.js';

@Module({})
export class AppModule {
  static forRoot(config: AppConfig): DynamicModule {
    return {
      module: AppModule,
      imports: [
        ConfigModule.forRoot(config),
        TypeOrmModule.forRoot({ ...typeormOptions(config.databaseUrl), autoLoadEntities: false }),
        RedisModule,
        HealthModule,
        ...FEATURE_MODULES,
      ],
      providers: [
        { provide: APP_GUARD, useClass: AccessGuard },
        { provide: APP_FILTER, useClass: ProblemFilter },
      ],
    };
  }
}
