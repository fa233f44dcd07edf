// Local object storage for test-frame originals and thumbnails: s3rver (an S3-compatible server)
// in-process on 127.0.0.1, ephemeral port, one bucket. Data lives under `dir` (npm start) or a
// temporary directory that stop() removes (tests).
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import S3rver from 's3rver';

const BUCKET = 'lumenwright-frames';
// s3rver accepts exactly these credentials (its documented defaults).
const ACCESS_KEY = 'S3RVER';
const SECRET_KEY = 'S3RVER';

export async function start({ dir, log = () => undefined, port = 0 } = {}) {
  const temporary = !dir;
  const directory = dir ?? fs.mkdtempSync(path.join(os.tmpdir(), 'lumenwright-s3-'));
  fs.mkdirSync(directory, { recursive: true });
  const server = new S3rver({
    address: '127.0.0.1',
    port,
    silent: true,
    directory,
    configureBuckets: [{ name: BUCKET }],
  });
  const info = await server.run();
  const url = `http://127.0.0.1:${info.port}`;
  log(`Object storage (s3rver) on ${url}, bucket ${BUCKET}`);
  return {
    env: {
      S3_ENDPOINT: url,
      S3_BUCKET: BUCKET,
      S3_REGION: 'us-east-1',
      S3_ACCESS_KEY_ID: ACCESS_KEY,
      S3_SECRET_ACCESS_KEY: SECRET_KEY,
    },
    urls: [['object storage', url]],
    stop: async () => {
      await server.close();
      if (temporary) fs.rmSync(directory, { recursive: true, force: true });
    },
  };
}
