// The baseline for `npm run bench`: the same balance computation behind bare node:http — JSON body
// parsing, a bearer-token check in a Map, solveBalance from shared/, JSON out. No framework.
import http from 'node:http';
import { solveBalance } from '@lumenwright/shared';
import { benchKeys } from './keys.mjs';

const port = Number(process.argv[2] ?? 0);
const keys = benchKeys();

const server = http.createServer((req, res) => {
  if (req.method !== 'POST' || req.url !== '/v1/balance') {
    res.writeHead(404).end();
    return;
  }
  const auth = req.headers.authorization ?? '';
  if (!keys.has(auth.slice(7))) {
    res.writeHead(401, { 'content-type': 'application/problem+json' }).end('{"status":401}');
    return;
  }
  const chunks = [];
  req.on('data', (c) => chunks.push(c));
  req.on('end', () => {
    try {
      const body = JSON.parse(Buffer.concat(chunks).toString('utf8'));
      const out = JSON.stringify(solveBalance(body));
      res.writeHead(200, { 'content-type': 'application/json' }).end(out);
    } catch (e) {
      res
        .writeHead(422, { 'content-type': 'application/problem+json' })
        .end(JSON.stringify({ detail: e.message }));
    }
  });
});

server.listen(port, '127.0.0.1', () => {
  process.send?.({ port: server.address().port });
  console.log(`bare baseline on 127.0.0.1:${server.address().port}`);
});
process.on('SIGTERM', () => server.close(() => process.exit(0)));
