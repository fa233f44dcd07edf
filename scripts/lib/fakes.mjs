// Local stand-ins for hosted services, each on loopback: started by `npm start` and the tests.
// A fake is a module under scripts/lib exporting start({dir, log, persist}) → {env, urls, stop};
// `persist` asks a fake that can to keep its state in `dir` across restarts (npm start does).
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const here = path.dirname(fileURLToPath(import.meta.url));
const FAKES = ['maildev.mjs', 'payments-fake.mjs', 's3-fake.mjs'];

export async function startFakes({ root, dataDir, log = console.log, persist = false }) {
  const started = [];
  const env = {};
  const urls = [];
  for (const file of FAKES) {
    const p = path.join(here, file);
    if (!fs.existsSync(p)) continue;
    const mod = await import(p);
    const dir = path.join(dataDir, file.replace(/\.mjs$/, ''));
    const f = await mod.start({ root, dir, log, persist });
    // The mail fake describes itself by its SMTP and inbox URLs.
    if (!f.env && f.smtpUrl) {
      f.env = { SMTP_URL: f.smtpUrl, MAIL_INBOX_URL: f.webUrl };
      f.urls = [['Mail inbox', `${f.webUrl}/`]];
    }
    started.push(f);
    Object.assign(env, f.env ?? {});
    urls.push(...(f.urls ?? []));
  }
  return {
    env,
    urls,
    stop: async () => {
      for (const f of started.reverse()) await f.stop();
    },
  };
}
