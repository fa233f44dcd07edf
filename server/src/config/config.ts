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
  /** Slow clients: the longest the request head may take to arrive (Node's headersTimeout). */
  httpHeadersTimeoutMs: number;
  /** The longest a whole request (head and body) may take to arrive; sized for the largest upload. */
  httpRequestTimeoutMs: number;
  /** How long an idle keep-alive connection stays open between requests. */
  httpKeepAliveTimeoutMs: number;
  smtpUrl: string | null;
  mailFrom: string;
  /** The Redis behind RATE_LIMIT_STORE=redis (required then, unused otherwise). */
  redisUrl: string | null;
  /** Sign-ups accepted from one IP address per hour (abuse of account creation). */
  signUpsPerIpPerHour: number;
  /** Metering and limits (compute API): see the usage and plans features. */
  rateLimitStore: 'memory' | 'postgres' | 'redis';
  usageFlushMs: number;
  usageBatchSize: number;
  usageMaxBuffer: number;
  quotaLeaseSize: number;
  /** Test-frame uploads (src/frames): object storage (S3 API) and limits; null endpoint = off. */
  s3Endpoint: string | null;
  s3Bucket: string;
  s3Region: string;
  s3AccessKeyId: string;
  s3SecretAccessKey: string;
  framesMaxBytes: number;
  framesMaxPixels: number;
  /** Objects under frames/ with no row, older than this, are deleted by the sweeper. */
  framesOrphanMinAgeMinutes: number;
  /** How often each instance sweeps orphaned frame objects; 0 = never. */
  framesSweepIntervalMinutes: number;
  /** Billing (src/billing): the payments API (a local fake in development); null URL = off. */
  paymentsApiUrl: string | null;
  paymentsSecretKey: string;
  paymentsWebhookSecret: string;
  /** Register this server's webhook URL with the payments API at boot (the local fake only). */
  paymentsRegisterWebhook: boolean;
}

export class ConfigError extends Error {}

/**
 * The upload speed the default request timeout allows for: 1 Mbit/s, a weak mobile uplink on
 * location (an assumption, common practice, no source). The largest upload (FRAMES_MAX_BYTES,
 * 25 MiB by default) takes 25 × 1,048,576 × 8 / 1,000,000 ≈ 210 s at that speed.
 */
export const SLOW_LINK_BITS_PER_SECOND = 1_000_000;
/** Added to the upload's transfer time: the head, the multipart framing, a TLS handshake, jitter. */
export const REQUEST_TIMEOUT_MARGIN_MS = 30_000;

/** The default request timeout: the largest upload at SLOW_LINK_BITS_PER_SECOND, plus the margin. */
export function requestTimeoutFor(maxUploadBytes: number): number {
  const transferMs = Math.ceil((maxUploadBytes * 8 * 1000) / SLOW_LINK_BITS_PER_SECOND);
  return Math.ceil((transferMs + REQUEST_TIMEOUT_MARGIN_MS) / 1000) * 1000;
}

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
    if (!/^https?:\/\/[^/]+$/.test(o))
      throw new ConfigError(`CORS_ORIGINS: "${o}" is not an origin`);
  }
  const smtpUrl = env.SMTP_URL ?? null;
  if (smtpUrl && !/^smtps?:\/\//.test(smtpUrl)) throw new ConfigError('SMTP_URL must be smtp://');
  const redisUrl = env.REDIS_URL || null;
  if (redisUrl && !/^rediss?:\/\/[^/?#]+/.test(redisUrl)) {
    throw new ConfigError('REDIS_URL must be a redis:// (or rediss://) URL');
  }
  const store = rateLimitStore(env.RATE_LIMIT_STORE);
  if (store === 'redis' && !redisUrl) {
    throw new ConfigError(
      'RATE_LIMIT_STORE=redis needs REDIS_URL (e.g. redis://127.0.0.1:6379): the Redis that holds the shared rate-limit buckets',
    );
  }
  const framesMaxBytes = int(env, 'FRAMES_MAX_BYTES', 25 * 1024 * 1024, 1024, 200 * 1024 * 1024);
  const http = httpTimeouts(env, framesMaxBytes);
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
    ...http,
    smtpUrl,
    mailFrom: env.MAIL_FROM ?? 'Lumenwright <no-reply@lumenwright.test>',
    redisUrl,
    signUpsPerIpPerHour: int(
      env,
      'SIGNUPS_PER_IP_PER_HOUR',
      nodeEnv === 'test' ? 1_000_000 : 20,
      1,
      1_000_000,
    ),
    rateLimitStore: store,
    usageFlushMs: int(env, 'USAGE_FLUSH_MS', 200, 10, 60_000),
    usageBatchSize: int(env, 'USAGE_BATCH_SIZE', 1000, 1, 10_000),
    usageMaxBuffer: int(env, 'USAGE_MAX_BUFFER', 50_000, 100, 1_000_000),
    quotaLeaseSize: int(env, 'QUOTA_LEASE_SIZE', 50, 1, 10_000),
    s3Endpoint: loopbackOrHttps(env, 'S3_ENDPOINT'),
    s3Bucket: env.S3_BUCKET ?? 'lumenwright-frames',
    s3Region: env.S3_REGION ?? 'us-east-1',
    s3AccessKeyId: env.S3_ACCESS_KEY_ID ?? '',
    s3SecretAccessKey: env.S3_SECRET_ACCESS_KEY ?? '',
    framesMaxBytes,
    framesMaxPixels: int(env, 'FRAMES_MAX_PIXELS', 100_000_000, 1, 1_000_000_000),
    framesOrphanMinAgeMinutes: int(env, 'FRAMES_ORPHAN_MIN_AGE_MINUTES', 60, 10, 7 * 24 * 60),
    framesSweepIntervalMinutes: int(env, 'FRAMES_SWEEP_INTERVAL_MINUTES', 60, 0, 7 * 24 * 60),
    paymentsApiUrl: loopbackOrHttps(env, 'PAYMENTS_API_URL'),
    paymentsSecretKey: env.PAYMENTS_SECRET_KEY ?? '',
    paymentsWebhookSecret: env.PAYMENTS_WEBHOOK_SECRET ?? '',
    paymentsRegisterWebhook: env.PAYMENTS_REGISTER_WEBHOOK === 'true',
  };
}

/**
 * Limits against slow clients. Node's defaults here: 60 s for the head, Fastify's 0 (none) for
 * the whole request, 72 s keep-alive. The head arrives in one packet from any ordinary client, so
 * 10 s is generous; the whole request gets the time the largest upload needs on a slow link; an
 * idle keep-alive connection is kept 65 s, longer than the 60 s idle timeout common at load
 * balancers (common practice, no source), so the balancer closes it first, never mid-reuse.
 */
function httpTimeouts(env: NodeJS.ProcessEnv, framesMaxBytes: number) {
  const httpHeadersTimeoutMs = int(env, 'HTTP_HEADERS_TIMEOUT_MS', 10_000, 1_000, 120_000);
  const httpRequestTimeoutMs = int(
    env,
    'HTTP_REQUEST_TIMEOUT_MS',
    requestTimeoutFor(framesMaxBytes),
    1_000,
    3_600_000,
  );
  if (httpRequestTimeoutMs < httpHeadersTimeoutMs) {
    throw new ConfigError(
      `HTTP_REQUEST_TIMEOUT_MS (${httpRequestTimeoutMs}) must be at least HTTP_HEADERS_TIMEOUT_MS (${httpHeadersTimeoutMs}): the whole request includes its head`,
    );
  }
  const httpKeepAliveTimeoutMs = int(env, 'HTTP_KEEP_ALIVE_TIMEOUT_MS', 65_000, 1_000, 600_000);
  return { httpHeadersTimeoutMs, httpRequestTimeoutMs, httpKeepAliveTimeoutMs };
}

function rateLimitStore(raw: string | undefined): AppConfig['rateLimitStore'] {
  if (raw === undefined || raw === '' || raw === 'memory') return 'memory';
  if (raw === 'postgres' || raw === 'redis') return raw;
  throw new ConfigError(`RATE_LIMIT_STORE must be memory, postgres or redis (got "${raw}")`);
}

/** An optional service URL: https anywhere, or plain http on loopback (local fakes). */
function loopbackOrHttps(env: NodeJS.ProcessEnv, name: string): string | null {
  const raw = env[name];
  if (raw === undefined || raw === '') return null;
  if (!/^https:\/\/|^http:\/\/(127\.0\.0\.1|localhost)(:\d+)?(\/|$)/.test(raw)) {
    throw new ConfigError(`${name} must be an https:// URL, or http:// on 127.0.0.1`);
  }
  return raw.replace(/\/$/, '');
}

export const APP_CONFIG = Symbol('APP_CONFIG');
