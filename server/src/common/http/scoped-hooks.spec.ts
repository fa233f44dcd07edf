// scopedHooks against a real Fastify instance: hooks a plugin adds run only for the requests
// the predicate accepts, sync (done-style) and async hooks alike, and addHook is restored after.
import Fastify, { type FastifyInstance } from 'fastify';
import { isBearerOnly, isMultipart, scopedHooks } from './scoped-hooks.js';

async function appWithScopedPlugin(): Promise<{ app: FastifyInstance; seen: string[] }> {
  const app = Fastify();
  const seen: string[] = [];
  const plugin = Object.assign(
    async (f: FastifyInstance) => {
      f.addHook('onRequest', (req, _reply, done) => {
        seen.push(`sync ${req.url}`);
        done();
      });
      f.addHook('onRequest', async (req) => {
        seen.push(`async ${req.url}`);
      });
      f.addHook('onSend', (_req, reply, payload, done) => {
        void reply.header('x-scoped', 'yes');
        done(null, payload);
      });
    },
    // Same instance as the caller's, as fastify-plugin arranges for the real plugins.
    { [Symbol.for('skip-override')]: true },
  );
  await scopedHooks(
    app,
    (req) => req.headers['x-want'] === '1',
    () => app.register(plugin),
  );
  app.get('/a', async () => ({ ok: true }));
  app.get('/b', async () => ({ ok: true }));
  // Added after scopedHooks returned: not wrapped.
  app.addHook('onRequest', (req, _reply, done) => {
    seen.push(`plain ${req.url}`);
    done();
  });
  await app.ready();
  return { app, seen };
}

describe('scopedHooks', () => {
  it('runs the plugin hooks only for accepted requests', async () => {
    const { app, seen } = await appWithScopedPlugin();
    const skipped = await app.inject({ url: '/a' });
    const accepted = await app.inject({ url: '/b', headers: { 'x-want': '1' } });
    expect(skipped.statusCode).toBe(200);
    expect(skipped.headers['x-scoped']).toBeUndefined();
    expect(accepted.statusCode).toBe(200);
    expect(accepted.headers['x-scoped']).toBe('yes');
    expect(seen).toEqual(['plain /a', 'sync /b', 'async /b', 'plain /b']);
    await app.close();
  });

  it('tells bearer-only and multipart requests apart', () => {
    expect(isBearerOnly({ headers: { authorization: 'Bearer lw_test_x' } })).toBe(true);
    expect(isBearerOnly({ headers: { authorization: 'bearer x', cookie: 'lw_session=1' } })).toBe(
      false,
    );
    expect(isBearerOnly({ headers: {} })).toBe(false);
    expect(isMultipart({ headers: { 'content-type': 'multipart/form-data; boundary=x' } })).toBe(
      true,
    );
    expect(isMultipart({ headers: { 'content-type': 'application/json' } })).toBe(false);
  });
});
