// Builds the configured application without listening: used by main.ts, the tests and the bins.
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import type { Duplex } from 'node:stream';
import { ValidationError, ValidationPipe } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import { FastifyAdapter, NestFastifyApplication } from '@nestjs/platform-fastify';
import { SwaggerModule } from '@nestjs/swagger';
import fastifyCors from '@fastify/cors';
import fastifyMultipart from '@fastify/multipart';
import fastifyStatic from '@fastify/static';
import type { FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import { AppModule } from './app.module.js';
import { registerSessions } from './auth/session.plugin.js';
import { DomainError, invalidInput } from './common/errors/domain-error.js';
import { findNul, nulProblem, queryNul } from './common/http/nul-text.js';
import { isMultipart, scopedHooks } from './common/http/scoped-hooks.js';
import { registerSecurityHeaders } from './common/http/security-headers.js';
import { createLogger, PinoNestLogger, registerRequestLogging } from './common/logging/logging.js';
import { noRouteProblem, toProblem } from './common/filters/problem.filter.js';
import { trackAllowedMethods } from './common/http/allowed-methods.js';
import { AppConfig, loadConfig } from './config/config.js';
import { buildOpenApiDocument } from './openapi.js';

const REQUEST_ID = /^[A-Za-z0-9._:-]{1,128}$/;

export interface CreateAppOptions {
  /** Build without connecting to the database or opening a port (the spec writer). */
  preview?: boolean;
  /** Buffer Nest's own logs until pino is ready (the server); tests pass false. */
  bufferLogs?: boolean;
}

/**
 * The app for reading its routes and spec only (the spec writer, spec tests): no port, no
 * database connection; the configuration is placeholders.
 */
export function createPreviewApp(): Promise<NestFastifyApplication> {
  const config = loadConfig({
    NODE_ENV: 'production',
    DATABASE_URL: 'postgres://unused@127.0.0.1:1/unused',
    SESSION_SECRET: 'x'.repeat(32),
    LOG_LEVEL: 'silent',
  });
  return createApp(config, { preview: true });
}

export async function createApp(
  config: AppConfig,
  opts: CreateAppOptions = {},
): Promise<NestFastifyApplication> {
  const adapter = new FastifyAdapter({
    bodyLimit: config.bodyLimitBytes,
    requestIdHeader: false,
    genReqId: (req: { headers: Record<string, string | string[] | undefined> }) => {
      const given = req.headers['x-request-id'];
      return typeof given === 'string' && REQUEST_ID.test(given) ? given : randomUUID();
    },
    trustProxy: false,
    routerOptions: { ignoreTrailingSlash: true },
    // Refusals made before a route is found are problem+json too.
    frameworkErrors: (err: Error, _req: FastifyRequest, reply: FastifyReply) => {
      const { problem } = toProblem(err);
      void reply.code(problem.status).type('application/problem+json').send(problem);
    },
    clientErrorHandler: writeClientError,
    // Slow clients (HTTP_*_TIMEOUT_MS in src/config/config.ts): a head or a whole request that
    // takes too long to arrive is answered 408 (writeClientError) and the connection closed.
    http: {
      headersTimeout: config.httpHeadersTimeoutMs,
      connectionsCheckingInterval: checkingIntervalMs(config.httpHeadersTimeoutMs),
    },
    requestTimeout: config.httpRequestTimeoutMs,
    keepAliveTimeout: config.httpKeepAliveTimeoutMs,
  });
  const app = await NestFactory.create<NestFastifyApplication>(AppModule.forRoot(config), adapter, {
    preview: opts.preview ?? false,
    logger: opts.preview || config.nodeEnv === 'test' ? false : undefined,
    bufferLogs: opts.bufferLogs ?? false,
    abortOnError: false,
    // JSON bodies are parsed by registerJsonBodies below, not by Nest's parser.
    bodyParser: false,
  });
  const logger = createLogger(opts.preview ? 'silent' : config.logLevel);
  if (!opts.preview) app.useLogger(new PinoNestLogger(logger));
  app.setGlobalPrefix('v1');
  // DTO validation for every route: failures become 422 problem+json naming each field.
  app.useGlobalPipes(validationPipe());
  app.enableShutdownHooks();

  const fastify = app.getHttpAdapter().getInstance();
  trackAllowedMethods(fastify);
  registerJsonBodies(fastify, config.bodyLimitBytes);
  fastify.addHook('onRequest', (req, reply, done) => {
    void reply.header('X-Request-Id', req.id);
    const nulField = queryNul(req.url);
    done(nulField === null ? undefined : nulProblem(nulField));
  });
  registerRequestLogging(fastify, logger);
  // Errors Fastify raises itself (body limits, bad JSON) reach the error handler Nest installs at
  // init, and from there the global ProblemFilter: every refusal is problem+json.

  // Security headers: helmet's set for pages, the OWASP API set for /v1 answers, computed once
  // (src/common/http/security-headers.ts).
  registerSecurityHeaders(fastify, config.publicUrl.startsWith('https://'));
  await app.register(fastifyCors, {
    origin: config.corsOrigins.length ? config.corsOrigins : false,
    credentials: false,
    methods: ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'],
    // Idempotency-Key: the metered POSTs honour it (src/idempotency); a replayed answer says so.
    allowedHeaders: ['Authorization', 'Content-Type', 'X-Request-Id', 'Idempotency-Key'],
    exposedHeaders: [
      'X-Request-Id',
      'RateLimit',
      'RateLimit-Policy',
      'Retry-After',
      'Idempotency-Replayed',
    ],
    maxAge: 600,
  });

  // Frames: multipart uploads. fileSize is enforced while streaming (past it the part is cut
  // off and the route answers 413); the global JSON body limit does not apply to multipart.
  // Its temp-file cleanup hooks run only for multipart requests (src/common/http/scoped-hooks.ts).
  await scopedHooks(fastify, isMultipart, () =>
    app.register(fastifyMultipart, {
      limits: { fileSize: config.framesMaxBytes, files: 1, fields: 10, fieldSize: 1024, parts: 12 },
    }),
  );

  // Accounts: cookie + PostgreSQL-backed sessions + Origin-based CSRF refusal (src/auth/session.plugin.ts).
  await registerSessions(app, config, { preview: opts.preview ?? false });

  const document = buildOpenApiDocument(app);
  SwaggerModule.setup('docs', app, document, {
    useGlobalPrefix: false,
    jsonDocumentUrl: 'openapi.json',
    yamlDocumentUrl: 'openapi.yaml',
    customSiteTitle: 'Lumenwright API',
  });

  await registerConsole(app, config);
  return app;
}

/**
 * JSON request bodies: Fastify's own JSON parser (prototype-poisoning checks on), made once, with
 * the bytes kept as `req.rawBody` for the billing webhook's signature check. Nest's parser, which
 * this replaces, built a new JSON parser and two closures for every request. Other content types
 * (text/plain included) get a 415 problem, except multipart, which the uploads plugin parses; so
 * do compressed bodies. A NUL character (written `\u0000` in JSON) anywhere gets a 422 naming
 * the field.
 */
function registerJsonBodies(fastify: FastifyInstance, bodyLimit: number) {
  const parseJson = fastify.getDefaultJsonParser('error', 'error');
  if (fastify.hasContentTypeParser('text/plain')) fastify.removeContentTypeParser('text/plain');
  fastify.addContentTypeParser(
    'application/json',
    { parseAs: 'buffer', bodyLimit },
    (req: FastifyRequest & { rawBody?: Buffer }, body: Buffer | string, done) => {
      const encoding = req.headers['content-encoding'];
      if (encoding !== undefined && encoding.toLowerCase() !== 'identity') {
        done(
          new DomainError(
            'unsupported_media_type',
            `Content-Encoding ${encoding} is not accepted; send the JSON body uncompressed.`,
            [{ field: 'body', reason: 'must not be compressed' }],
          ),
        );
        return;
      }
      req.rawBody = body as Buffer;
      // Typed for strings; it parses Buffers too (secure-json-parse decodes them as UTF-8).
      void parseJson(req, body as unknown as string, (err, parsed) => {
        if (err) {
          // Valid JSON refused for prototype keys says so, rather than "not valid JSON".
          const poisoned = /"(__proto__|constructor)"\s*:/.test((body as Buffer).toString('utf8'));
          return done(poisoned ? protoProblem() : err);
        }
        // JSON can only carry U+0000 escaped; a quick byte search spares the walk otherwise.
        const field = (body as Buffer).includes('\\u0000') ? findNul(parsed) : null;
        return field === null ? done(null, parsed) : done(nulProblem(field));
      });
    },
  );
}

/**
 * How often Node checks the head and request timeouts of open connections (its default, 30 s,
 * would let a slow head hold a connection up to 30 s past a 10 s limit): a quarter of the head's
 * limit, at most 1 s. One pass over the connections each time: nothing next to the requests.
 */
export function checkingIntervalMs(headersTimeoutMs: number): number {
  return Math.min(1000, Math.floor(headersTimeoutMs / 4));
}

/**
 * Requests Node's HTTP parser refuses (headers too large, a timeout, malformed HTTP) never reach
 * Fastify: answer them on the socket as problem+json, then close it.
 */
function writeClientError(err: NodeJS.ErrnoException, socket: Duplex): void {
  if (err.code === 'ECONNRESET' || socket.destroyed) return;
  const status =
    err.code === 'HPE_HEADER_OVERFLOW' ? 431 : err.code === 'ERR_HTTP_REQUEST_TIMEOUT' ? 408 : 400;
  const detail =
    status === 431
      ? 'The request headers are larger than the server accepts.'
      : status === 408
        ? 'The request did not arrive in time.'
        : 'The request is not valid HTTP.';
  const { problem } = toProblem({ statusCode: status, message: detail });
  const body = JSON.stringify(problem);
  if (socket.writable) {
    socket.write(
      `HTTP/1.1 ${status} ${problem.title}\r\nContent-Type: application/problem+json\r\n` +
        `Content-Length: ${Buffer.byteLength(body)}\r\nConnection: close\r\n\r\n${body}`,
    );
  }
  socket.destroy(err);
}

function protoProblem(): DomainError {
  const reason = 'must not have a "__proto__" or "constructor.prototype" key';
  return new DomainError('invalid_input', `The body ${reason}.`, [{ field: 'body', reason }]);
}

/** Serves the built console at `/`, falling back to index.html for client-side routes. */
async function registerConsole(app: NestFastifyApplication, config: AppConfig) {
  const dist = config.consoleDist ? path.resolve(config.consoleDist) : null;
  const index = dist ? path.join(dist, 'index.html') : null;
  const fastify = app.getHttpAdapter().getInstance();
  if (dist && index && fs.existsSync(index)) {
    await app.register(fastifyStatic, {
      root: dist,
      prefix: '/',
      wildcard: false,
      index: false,
      maxAge: '1h',
      setHeaders: (res, filePath) => {
        if (filePath.includes(`${path.sep}assets${path.sep}`)) {
          void res.header('Cache-Control', 'public, max-age=31536000, immutable');
        }
      },
    });
  }
  // Re-read when the file changes, so a console rebuild is served without a restart.
  let cached: { mtimeMs: number; html: string } | null = null;
  const indexHtml = (): string | null => {
    if (!index) return null;
    try {
      const { mtimeMs } = fs.statSync(index);
      if (cached?.mtimeMs !== mtimeMs) cached = { mtimeMs, html: fs.readFileSync(index, 'utf8') };
      return cached.html;
    } catch {
      return null;
    }
  };
  fastify.get('/*', async (req: FastifyRequest, reply: FastifyReply) => {
    const p = req.url.split('?')[0] ?? '/';
    // Built files are routed at boot; one added by a console rebuild since is served from here.
    // A missing file is a 404, never the page (a script answered with HTML leaves a blank page).
    if (p.startsWith('/assets/') && dist && typeof reply.sendFile === 'function') {
      let name = '';
      try {
        name = decodeURIComponent(p.slice(1));
      } catch {
        // not a file name: the 404 below
      }
      const file = name && path.resolve(dist, name);
      if (file && file.startsWith(dist + path.sep) && fs.existsSync(file)) {
        return reply.header('Cache-Control', 'public, max-age=31536000, immutable').sendFile(name);
      }
    }
    const html = indexHtml();
    const asset = p.startsWith('/assets/') || /\.[a-z0-9]{1,8}$/i.test(p);
    if (p.startsWith('/v1/') || p === '/v1' || p.startsWith('/docs') || asset || !html) {
      const { problem, headers } = noRouteProblem(req, p);
      void reply.headers(headers);
      problem.instance = p;
      problem.requestId = String(req.id);
      return reply.status(problem.status).type('application/problem+json').send(problem);
    }
    return reply.header('Cache-Control', 'no-cache').type('text/html; charset=utf-8').send(html);
  });
  fastify.get('/', async (_req: FastifyRequest, reply: FastifyReply) => {
    const html = indexHtml();
    if (!html) return reply.type('text/plain').send('Lumenwright API — see /docs');
    return reply.header('Cache-Control', 'no-cache').type('text/html; charset=utf-8').send(html);
  });
}

/**
 * class-validator DTOs; errors are flattened to `[{field, reason}]` with paths like `a[1].b`,
 * worded like the compute validator's: a missing field "is required", and a field gets one
 * problem, its type check when it fails one (not "must be a string" and a length as well).
 */
function validationPipe(): ValidationPipe {
  const flatten = (errs: ValidationError[], parent = ''): { field: string; reason: string }[] =>
    errs.flatMap((e) => {
      // Array items as `pieces[1].lossStops`, the same style as the compute validator's paths.
      const field = !parent
        ? e.property
        : /^\d+$/.test(e.property)
          ? `${parent}[${e.property}]`
          : `${parent}.${e.property}`;
      // class-validator prefixes messages with the property name; keep only the reason.
      const reasons = Object.values(e.constraints ?? {}).map((msg) =>
        msg.startsWith(`${e.property} `) ? msg.slice(e.property.length + 1) : msg,
      );
      // Constraints come in the reverse of the decorators' order in the source, where each DTO
      // puts its type check first: the last one is the type check. A field left out is checked
      // only when it is not optional, so it is required (in a DTO's own words when it has them:
      // "is required unless greenShift is sent").
      const reason = !reasons.length
        ? undefined
        : 'whitelistValidation' in (e.constraints ?? {})
          ? 'is not a known field'
          : e.value === undefined
            ? (reasons.find((r) => r.startsWith('is required')) ?? 'is required')
            : reasons[reasons.length - 1];
      const own = reason === undefined ? [] : [{ field, reason }];
      return [...own, ...flatten(e.children ?? [], field)];
    });
  return new ValidationPipe({
    transform: true,
    whitelist: true,
    forbidNonWhitelisted: true,
    // The value on each error tells a field left out from one sent wrong; it is never shown.
    validationError: { target: false, value: true },
    exceptionFactory: (errs) => invalidInput(flatten(errs)),
  });
}
