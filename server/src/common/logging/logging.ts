// Logging: one pino logger for Nest's own messages and for one line per HTTP request.
//
// Request lines come from a Fastify onResponse hook rather than per-request middleware: no child
// logger, no AsyncLocalStorage and no closures are made for a call whose line is filtered out by
// the level, which matters on the metered hot path (see the README's performance section).
import type { LoggerService } from '@nestjs/common';
import type { FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import pino, { type Logger, type LevelWithSilent } from 'pino';

const METERED_PATH = /^\/v1\/(twilight|exposure|flash|falloff|backlight|balance|setup)(\?|$)/;

export function createLogger(level: string): Logger {
  return pino({
    level,
    redact: {
      // Request lines never carry headers or bodies; this is a second line of defence for anything
      // that logs a request or reply object by mistake.
      paths: [
        'req.headers.authorization',
        'req.headers.cookie',
        'req.headers["x-csrf-token"]',
        'res.headers["set-cookie"]',
        'password',
        'secret',
        'token',
      ],
      censor: '[redacted]',
    },
  });
}

/**
 * The level of a request's line: server errors are errors, refusals warnings, successful metered
 * calls debug (each is already a row in usage_events with its request id, status and latency, the
 * access log of the hot path), everything else info.
 */
export function requestLevel(method: string, url: string, status: number): LevelWithSilent {
  if (status >= 500) return 'error';
  if (status >= 400) return 'warn';
  if (method === 'POST' && METERED_PATH.test(url)) return 'debug';
  return 'info';
}

export function registerRequestLogging(fastify: FastifyInstance, logger: Logger): void {
  fastify.addHook('onResponse', (req: FastifyRequest, reply: FastifyReply, done) => {
    const level = requestLevel(req.method, req.url, reply.statusCode);
    if (logger.isLevelEnabled(level)) {
      logger[level](
        {
          req: { id: req.id, method: req.method, url: req.url },
          res: { statusCode: reply.statusCode },
          responseTime: Math.round(reply.elapsedTime * 10) / 10,
        },
        'request completed',
      );
    }
    done();
  });
}

/** Nest's LoggerService on top of pino; the last string argument is Nest's context. */
/** Nest contexts that log one line per module or route at start-up. */
const BOOT_CHATTER = new Set(['InstanceLoader', 'RoutesResolver', 'RouterExplorer']);

export class PinoNestLogger implements LoggerService {
  constructor(private readonly logger: Logger) {}

  log(message: unknown, ...rest: unknown[]) {
    // Nest's start-up chatter (a line per module and per route) is for debugging the wiring.
    const context = rest[rest.length - 1];
    const chatter = typeof context === 'string' && BOOT_CHATTER.has(context);
    this.write(chatter ? 'debug' : 'info', message, rest);
  }
  error(message: unknown, ...rest: unknown[]) {
    this.write('error', message, rest);
  }
  warn(message: unknown, ...rest: unknown[]) {
    this.write('warn', message, rest);
  }
  debug(message: unknown, ...rest: unknown[]) {
    this.write('debug', message, rest);
  }
  verbose(message: unknown, ...rest: unknown[]) {
    this.write('trace', message, rest);
  }
  fatal(message: unknown, ...rest: unknown[]) {
    this.write('fatal', message, rest);
  }

  private write(level: pino.Level, message: unknown, rest: unknown[]) {
    if (!this.logger.isLevelEnabled(level)) return;
    const params = [...rest];
    const context =
      params.length && typeof params[params.length - 1] === 'string'
        ? (params.pop() as string)
        : undefined;
    const fields: Record<string, unknown> = context ? { context } : {};
    let msg: string | undefined;
    if (message instanceof Error) {
      fields.err = message;
      msg = message.message;
    } else if (message && typeof message === 'object') {
      Object.assign(fields, message);
      msg = typeof params[0] === 'string' ? (params.shift() as string) : undefined;
    } else {
      msg = String(message);
    }
    // Nest's error(message, stack, context) form.
    if (level === 'error' && typeof params[0] === 'string' && params[0].includes('\n    at ')) {
      fields.stack = params.shift();
    }
    this.logger[level](fields, msg);
  }
}
