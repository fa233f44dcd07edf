// Mail queued inside a transaction (an outbox): the job row commits with the change that caused it
// and rolls back with it. Real PostgreSQL, the real pg-boss queue and the SMTP fake.
import type { DataSource } from 'typeorm';
import { waitForMail, uniqueEmail } from '../factories/accounts.js';
import { freePort, sleep, startFakeWith, type RestartableFake } from '../factories/ops.js';
import { bootApp, type TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';
import { MailService } from '../../src/mail/mail.service.js';

describe('mail outbox', () => {
  let smtp: RestartableFake;
  let t: TestApp;
  let ds: DataSource;
  let mail: MailService;

  beforeAll(async () => {
    smtp = await startFakeWith('maildev', {
      smtpPort: await freePort(),
      webPort: await freePort(),
    });
    t = await bootApp({ SMTP_URL: String(smtp.info.smtpUrl) });
    ds = await openDataSource();
    mail = t.app.get(MailService);
  }, 60_000);

  afterAll(async () => {
    await t?.close();
    await ds?.destroy();
    await smtp?.stop();
  });

  const jobs = (to: string): Promise<{ state: string }[]> =>
    ds.query(`SELECT state FROM pgboss.job WHERE name = 'mail' AND data->>'to' = $1`, [to]);

  const seatsMail = (to: string) =>
    ({
      template: 'seats-over-plan',
      to,
      data: {
        name: 'Wren Halloway',
        organizationName: 'Outbox Test Studio',
        planName: 'Free',
        seats: 2,
        members: 3,
        link: 'http://127.0.0.1:3000/team',
      },
    }) as const;

  it('writes no job when the transaction that queued it rolls back', async () => {
    const to = uniqueEmail('rolled-back');
    await expect(
      ds.transaction(async (m) => {
        await mail.send(seatsMail(to), m);
        // Inside the transaction the row is there...
        const seen = await m.query(`SELECT 1 FROM pgboss.job WHERE data->>'to' = $1`, [to]);
        expect(seen).toHaveLength(1);
        throw new Error('the change failed after the mail was queued');
      }),
    ).rejects.toThrow('the change failed');
    // ...and after the rollback it is gone, so nothing is ever delivered.
    await sleep(1500);
    expect(await jobs(to)).toHaveLength(0);
    const inbox = (await (await fetch(`${String(smtp.info.webUrl)}/api/email`)).json()) as {
      to: { address: string }[];
    }[];
    expect(inbox.filter((x) => x.to.some((a) => a.address === to))).toHaveLength(0);
  }, 30_000);

  it('is invisible to the worker until the transaction commits, then delivered once', async () => {
    const to = uniqueEmail('committed');
    await ds.transaction(async (m) => {
      await mail.send(seatsMail(to), m);
      // Held open past several polls of the worker (0.5 s in tests): not visible, not sent.
      await sleep(1500);
      expect(await jobs(to)).toHaveLength(0);
    });
    const msg = await waitForMail(`${String(smtp.info.webUrl)}/api`, to, /more members/, 20_000);
    expect(msg.text).toContain('which has 2 seats. Your studio has 3 members.');
    expect(await jobs(to)).toHaveLength(1);
  }, 40_000);
});
