// A second baseline for `npm run bench`: the same balance computation behind plain Fastify (the
// HTTP framework under our NestJS adapter) with its defaults — JSON body parsing, a bearer-token
// check in a Map, solveBalance from shared/, JSON out. No Nest, no auth, limits or metering: the
// gap between this and bare node:http is the framework's floor; the rest of the gap to
// Lumenwright is ours.
import Fastify from 'fastify';
import { solveBalance } from '@lumenwright/shared';
import { benchKeys } from './keys.mjs';

const port = Number(process.argv[2] ?? 0);
const keys = benchKeys();

const app = Fastify({ logger: false });
app.post('/v1/balance', async (req, reply) => {
  const auth = req.headers.authorization ?? '';
  if (!keys.has(auth.slice(7))) {
    return reply.code(401).type('application/problem+json').send({ status: 401 });
  }
  try {
    return solveBalance(req.body);
  } catch (e) {
    return reply.code(422).type('application/problem+json').send({ detail: e.message });
  }
});

await app.listen({ port, host: '127.0.0.1' });
process.send?.({ port: app.server.address().port });
process.on('SIGTERM', () => app.close().then(() => process.exit(0)));
