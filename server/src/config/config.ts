// The only reader of process.env: parsed and validated once at boot.
import { randomBytes } from 'node:crypto';

export interface AppConfig {
  nodeEnv: 'development' | 'production' | 'test';
  host: string;
  port: number;
  databaseUrl: string;
  publicUrl: string;
  corsOrigins: string[];
  sessionSecret: string;
  consoleDist: string | null;
  logLevel: string;
  bodyLimitBytes: number;
  smtpUrl: string | null;
  mailFrom: string;
  redisUrl: string | null;
}

export class ConfigError extends Error {}

function int(env: NodeJS.ProcessEnv, name: string, fallback: number, min: number, max: number) {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < min || n > max) {
    throw new ConfigError(`${name} must be an integer between ${min} and ${max} (got "${raw}")`);
  }
  return n;
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const nodeEnv = (env.NODE_ENV ?? 'development') as AppConfig['nodeEnv'];
  if (!['development', 'production', 'test'].includes(nodeEnv)) {
    throw new ConfigError(`NODE_ENV must be development, production or test (got "${nodeEnv}")`);
  }
  const databaseUrl = env.DATABASE_URL ?? '';
  if (!/^postgres(ql)?:\/\//.test(databaseUrl)) {
    throw new ConfigError('DATABASE_URL must be a postgres:// URL');
  }
  const port = int(env, 'PORT', 3000, 0, 65535);
  const host = env.HOST ?? '127.0.0.1';
  const publicUrl = (env.PUBLIC_URL ?? `http://${host}:${port}`).replace(/\/$/, '');
  const sessionSecret = env.SESSION_SECRET ?? '';
  if (nodeEnv === 'production' && sessionSecret.length < 32) {
    throw new ConfigError('SESSION_SECRET must be at least 32 characters in production');
  }
  const corsOrigins = (env.CORS_ORIGINS ?? '')
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean);
  for (const o of corsOrigins) {
    if (!/^https?:\/\/[^/]+$/.test(o)) throw new ConfigError(`CORS_ORIGINS: "${o}" is not an origin`);
  }
  const smtpUrl = env.SMTP_URL ?? null;
  if (smtpUrl && !/^smtps?:\/\//.test(smtpUrl)) throw new ConfigError('SMTP_URL must be smtp://');
  return {
    nodeEnv,
    host,
    port,
    databaseUrl,
    publicUrl,
    corsOrigins,
    sessionSecret: sessionSecret.length >= 32 ? sessionSecret : randomBytes(32).toString('hex'),
    consoleDist: env.CONSOLE_DIST ?? null,
    logLevel: env.LOG_LEVEL ?? (nodeEnv === 'test' ? 'silent' : 'info'),
    bodyLimitBytes: int(env, 'BODY_LIMIT_BYTES', 100 * 1024, 1024, 50 * 1024 * 1024),
    smtpUrl,
    mailFrom: env.MAIL_FROM ?? 'Lumenwright <no-reply@lumenwright.test>',
    redisUrl: env.REDIS_URL ?? null,
  };
}

export const APP_CONFIG = Symbol('APP_CONFIG');
