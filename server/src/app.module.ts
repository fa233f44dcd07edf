import { DynamicModule, Module, RequestMethod } from '@nestjs/common';
import { APP_FILTER, APP_GUARD } from '@nestjs/core';
import { TypeOrmModule } from '@nestjs/typeorm';
import { LoggerModule } from 'nestjs-pino';
import { AccessGuard } from './common/guards/access.guard.js';
import { ProblemFilter } from './common/filters/problem.filter.js';
import { AppConfig } from './config/config.js';
import { ConfigModule } from './config/config.module.js';
import { typeormOptions } from './database/typeorm.options.js';
import { HealthModule } from './health/health.module.js';
import { FEATURE_MODULES } from './features.js';

const METERED_PATH = /^\/v1\/(twilight|exposure|flash|falloff|backlight|balance|setup)(\?|$)/;

@Module({})
export class AppModule {
  static forRoot(config: AppConfig): DynamicModule {
    return {
      module: AppModule,
      imports: [
        ConfigModule.forRoot(config),
        LoggerModule.forRoot({
          forRoutes: [{ path: '{*splat}', method: RequestMethod.ALL }],
          pinoHttp: {
            level: config.logLevel,
            genReqId: (req) => (req as { id?: string }).id ?? '',
            redact: {
              paths: [
                'req.headers.authorization',
                'req.headers.cookie',
                'req.headers["x-csrf-token"]',
                'res.headers["set-cookie"]',
              ],
              censor: '[redacted]',
            },
            // Successful metered calls are not logged line by line: each one is already a row in
            // usage_events with its request id, status and latency (the access log for the hot
            // path); a log line per call cost ~10% of CPU under load. Everything else is logged.
            customLogLevel: (req, res, err) =>
              err || res.statusCode >= 500
                ? 'error'
                : res.statusCode >= 400
                  ? 'warn'
                  : req.method === 'POST' && METERED_PATH.test(req.url ?? '')
                    ? 'debug'
                    : 'info',
            serializers: {
              req: (req: { id: string; method: string; url: string }) => ({
                id: req.id,
                method: req.method,
                url: req.url,
              }),
              res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
            },
          },
        }),
        TypeOrmModule.forRoot({ ...typeormOptions(config.databaseUrl), autoLoadEntities: false }),
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
