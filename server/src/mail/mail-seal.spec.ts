import { sealMail, unsealMail, type MailJob } from './mail.service.js';

describe('queued mail sealing', () => {
  const job: MailJob = {
    template: 'password-reset',
    to: 'someone@example.test',
    data: { name: 'Someone', link: 'http://127.0.0.1/reset?token=abc123secret', expiresAt: 'x' },
  };

  it('round-trips the data and keeps only the template and recipient readable', () => {
    const q = sealMail(job, 's'.repeat(40));
    expect(JSON.stringify(q)).not.toContain('abc123secret');
    expect(q).toMatchObject({ template: 'password-reset', to: 'someone@example.test' });
    expect(unsealMail(q, 's'.repeat(40))).toEqual(job);
  });

  it('refuses a sealed job opened with another secret or altered in storage', () => {
    const q = sealMail(job, 's'.repeat(40));
    expect(() => unsealMail(q, 't'.repeat(40))).toThrow();
    const raw = Buffer.from(q.sealed, 'base64');
    raw[raw.length - 1] = raw[raw.length - 1]! ^ 1;
    expect(() => unsealMail({ ...q, sealed: raw.toString('base64') }, 's'.repeat(40))).toThrow();
  });
});
