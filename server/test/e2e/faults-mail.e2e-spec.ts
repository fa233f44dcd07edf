// §2 faults: the SMTP fake goes down and comes back on the same port; mail waits in the queue.
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { signUp, waitForMail, type SignedInAgent } from '../factories/accounts.js';
import { eventually } from '../factories/billing.js';
import { freePort, sleep, startFakeWith, type RestartableFake } from '../factories/ops.js';
import { bootApp, type TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';

describe('faults: SMTP down', () => {
  const ports = { smtp: 0, web: 0 };
  let mail: RestartableFake;
  let t: TestApp;
  let ds: DataSource;
  let owner: SignedInAgent;

  beforeAll(async () => {
    ports.smtp = await freePort();
    ports.web = await freePort();
    mail = await startFakeWith('maildev', { smtpPort: ports.smtp, webPort: ports.web });
    t = await bootApp({ SMTP_URL: String(mail.info.smtpUrl) });
    ds = await openDataSource();
    owner = await signUp(t.url, { organizationName: 'Lanternfield Mail Studio' });
  }, 60_000);

  afterAll(async () => {
    await t?.close();
    await ds?.destroy();
    await mail?.stop();
  });

  const mailJobs = (to: string) =>
    ds.query(`SELECT state, retry_count FROM pgboss.job WHERE name = 'mail' AND data->>'to' = $1`, [
      to,
    ]) as Promise<{ state: string; retry_count: number }[]>;

  it('SMTP down: the mail stays queued and is delivered once when SMTP returns', async () => {
    await mail.stop();
    const t0 = Date.now();
    await request(t.url).post('/v1/auth/password-reset').send({ email: owner.email }).expect(202);
    expect(Date.now() - t0).toBeLessThan(2000); // the request never waits for SMTP
    // The first delivery attempt fails (connection refused) and the job waits for a retry.
    await eventually(async () => {
      const jobs = await mailJobs(owner.email);
      return jobs.length === 1 && jobs[0]!.state === 'retry';
    }, 10_000);
    await sleep(500);
    mail = await startFakeWith('maildev', { smtpPort: ports.smtp, webPort: ports.web });
    const msg = await waitForMail(
      `${String(mail.info.webUrl)}/api`,
      owner.email,
      /password/i,
      30_000,
    );
    expect(msg.text).toMatch(/token=/);
    const done = await eventually(async () => {
      const jobs = await mailJobs(owner.email);
      return jobs[0]?.state === 'completed' ? jobs : null;
    });
    expect(done).toHaveLength(1);
    expect(done![0]!.retry_count).toBeGreaterThanOrEqual(1); // delivered by a retry
    await sleep(1000);
    const inbox = (await (await fetch(`${String(mail.info.webUrl)}/api/email`)).json()) as {
      to: { address: string }[];
    }[];
    expect(inbox.filter((m) => m.to.some((x) => x.address === owner.email))).toHaveLength(1);
  }, 60_000);
});
