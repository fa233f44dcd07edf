// Request-line levels and Nest's logger calls mapped onto pino lines (pino is the reference for
// the line format: level numbers 20 debug, 30 info, 40 warn, 50 error — https://getpino.io).
import { Writable } from 'node:stream';
import pino from 'pino';
import { PinoNestLogger, requestLevel } from './logging.js';

function capture() {
  const lines: Record<string, unknown>[] = [];
  const sink = new Writable({
    write(chunk: Buffer, _enc, cb) {
      lines.push(JSON.parse(chunk.toString()) as Record<string, unknown>);
      cb();
    },
  });
  return { lines, logger: pino({ level: 'debug' }, sink) };
}

describe('requestLevel', () => {
  it('errors for 5xx, warnings for 4xx, debug for successful metered calls, info otherwise', () => {
    expect(requestLevel('POST', '/v1/balance', 500)).toBe('error');
    expect(requestLevel('POST', '/v1/balance', 429)).toBe('warn');
    expect(requestLevel('POST', '/v1/balance', 200)).toBe('debug');
    expect(requestLevel('POST', '/v1/setup?x=1', 200)).toBe('debug');
    expect(requestLevel('GET', '/v1/balance', 200)).toBe('info');
    expect(requestLevel('POST', '/v1/setups', 201)).toBe('info');
    expect(requestLevel('POST', '/v1/auth/sign-in', 200)).toBe('info');
  });
});

describe('PinoNestLogger', () => {
  it('keeps the context, merges object fields and maps levels', () => {
    const { lines, logger } = capture();
    const nest = new PinoNestLogger(logger);
    nest.log('started', 'Boot');
    nest.warn({ requestId: 'r1' }, 'slow flush', 'UsageWriter');
    nest.error('failed', 'Error: x\n    at y (z.js:1:1)', 'Mailer');
    nest.verbose('hidden at debug', 'Boot');
    expect(lines).toHaveLength(3);
    expect(lines[0]).toMatchObject({ level: 30, msg: 'started', context: 'Boot' });
    expect(lines[1]).toMatchObject({
      level: 40,
      msg: 'slow flush',
      requestId: 'r1',
      context: 'UsageWriter',
    });
    expect(lines[2]).toMatchObject({ level: 50, msg: 'failed', context: 'Mailer' });
    expect(String(lines[2]!.stack)).toContain('at y');
  });

  it("puts Nest's per-module and per-route start-up lines at debug, its other lines at info", () => {
    const { lines, logger } = capture();
    const nest = new PinoNestLogger(logger);
    nest.log('AppModule dependencies initialized', 'InstanceLoader');
    nest.log('ComputeController {/v1}:', 'RoutesResolver');
    nest.log('Mapped {/v1/balance, POST} route', 'RouterExplorer');
    nest.log('Nest application successfully started', 'NestApplication');
    expect(lines.map((l) => [l.context, l.level])).toEqual([
      ['InstanceLoader', 20],
      ['RoutesResolver', 20],
      ['RouterExplorer', 20],
      ['NestApplication', 30],
    ]);
  });

  it('serialises errors passed as the message', () => {
    const { lines, logger } = capture();
    new PinoNestLogger(logger).error(new Error('boom'), 'X');
    expect(lines[0]).toMatchObject({ level: 50, msg: 'boom', context: 'X' });
    expect((lines[0]!.err as { type: string }).type).toBe('Error');
  });
});
