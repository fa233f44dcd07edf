// Boots the real application on the test database, listening on an ephemeral loopback port.
import type { NestFastifyApplication } from '@nestjs/platform-fastify';
import { createApp } from '../../src/app.factory.js';
import { AppConfig, loadConfig } from '../../src/config/config.js';
import { migrate } from './db.js';

export interface TestApp {
  app: NestFastifyApplication;
  url: string;
  config: AppConfig;
  close(): Promise<void>;
}

export async function bootApp(env: Record<string, string> = {}): Promise<TestApp> {
  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: process.env.TEST_DATABASE_URL!,
    LOG_LEVEL: 'silent',
    PORT: '0',
    // One secret for every instance in a run, so any instance can open queued mail.
    SESSION_SECRET: 'test-session-secret-for-every-instance-0123456789',
    ...env,
  });
  await migrate();
  const app = await createApp(config);
  await app.listen({ port: 0, host: '127.0.0.1' });
  await app.getHttpAdapter().getInstance().ready();
  const addr = app.getHttpServer().address() as { port: number };
  const url = `http://127.0.0.1:${addr.port}`;
  return { app, url, config, close: () => app.close() };
}
