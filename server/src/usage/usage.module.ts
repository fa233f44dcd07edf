import { Module } from '@nestjs/common';
import pg from 'pg';
import { APP_CONFIG, AppConfig } from '../config/config.js';
import { MeteringHook } from './metering.hook.js';
import { UsagePartitions } from './usage-partitions.service.js';
import { USAGE_POOL, UsageWriter } from './usage-writer.service.js';
import { UsageController } from './usage.controller.js';
import { UsageService } from './usage.service.js';

@Module({
  controllers: [UsageController],
  providers: [
    {
      provide: USAGE_POOL,
      inject: [APP_CONFIG],
      // Its own small pool: metering writes never queue behind request queries, and it closes
      // only after the last flush at shutdown.
      useFactory: (config: AppConfig) => {
        const pool = new pg.Pool({
          connectionString: config.databaseUrl,
          max: 4,
          application_name: 'lumenwright-metering',
        });
        // A dropped idle connection must not crash the process; the next query reconnects.
        pool.on('error', () => undefined);
        return pool;
      },
    },
    UsageWriter,
    MeteringHook,
    UsagePartitions,
    UsageService,
  ],
  exports: [USAGE_POOL, UsageWriter, UsageService],
})
export class UsageModule {}
