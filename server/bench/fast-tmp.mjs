import Fastify from 'fastify';
import { solveBalance } from '@lumenwright/shared';
const keys = new Map((process.env.BENCH_KEYS ?? '').split(',').filter(Boolean).map((k) => [k, true]));
const app = Fastify({ logger: false });
app.post('/v1/balance', async (req, reply) => {
  const auth = req.headers.authorization ?? '';
  if (!keys.has(auth.slice(7))) { reply.code(401); return { status: 401 }; }
  return solveBalance(req.body);
});
await app.listen({ port: Number(process.argv[2]), host: '127.0.0.1' });
