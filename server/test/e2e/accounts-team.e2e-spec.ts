// Team: invitations by e-mail (read back from maildev), roles, the last-owner rule, audit log.
import request from 'supertest';
import { bootApp, TestApp } from '../setup/app.js';
import {
  addMember,
  MailInbox,
  PASSWORD,
  setPlan,
  signUp,
  SignedInAgent,
  startMaildev,
  tokenFromText,
  uniqueEmail,
  waitForMail,
} from '../factories/accounts.js';

describe('accounts: team', () => {
  let t: TestApp;
  let mail: MailInbox;
  let owner: SignedInAgent;
  const inviteToken = async (email: string) =>
    tokenFromText((await waitForMail(mail.webUrl, email, /invited/)).text);

  beforeAll(async () => {
    mail = await startMaildev();
    t = await bootApp({ SMTP_URL: mail.smtpUrl, PUBLIC_URL: 'http://127.0.0.1:3999' });
    owner = await signUp(t.url, { name: 'Mira Owner', organizationName: 'Lanternfield Studio' });
    await setPlan(owner.organizationId, 'studio'); // more people than the free plan's seats
  }, 90000);
  afterAll(async () => {
    await t?.close();
    await mail?.stop();
  });

  it('invites by e-mail (HTML + text), previews, and accepts as a new account', async () => {
    const email = uniqueEmail('newbie');
    const inv = await owner.agent
      .post('/v1/team/invites')
      .send({ email, role: 'photographer' })
      .expect(201);
    expect(inv.body).toMatchObject({
      email,
      role: 'photographer',
      status: 'pending',
      invitedBy: 'Mira Owner',
    });
    const days = (Date.parse(inv.body.expiresAt) - Date.now()) / 86400000;
    expect(days).toBeGreaterThan(6.99);
    expect(days).toBeLessThanOrEqual(7);
    const msg = await waitForMail(mail.webUrl, email, /invited to Lanternfield Studio/);
    expect(msg.html).toContain('Accept the invitation');
    expect(msg.text).toContain('http://127.0.0.1:3999/accept-invite?token=');
    const token = tokenFromText(msg.text);
    const preview = await request(t.url).post('/v1/invites/preview').send({ token }).expect(200);
    expect(preview.body).toMatchObject({
      organizationName: 'Lanternfield Studio',
      email,
      role: 'photographer',
      existingAccount: false,
    });
    const agent = request.agent(t.url);
    const missing = await agent.post('/v1/invites/accept').send({ token }).expect(422);
    expect(missing.body.errors.map((e: { field: string }) => e.field).sort()).toEqual([
      'name',
      'password',
    ]);
    const ok = await agent
      .post('/v1/invites/accept')
      .send({ token, name: 'New Person', password: PASSWORD })
      .expect(200);
    expect(ok.body).toMatchObject({
      role: 'photographer',
      organization: { id: owner.organizationId },
      user: { email },
    });
    await agent.get('/v1/me').expect(200);
    await request(t.url)
      .post('/v1/invites/accept')
      .send({ token, name: 'Again', password: PASSWORD })
      .expect(404);
    const list = await owner.agent.get('/v1/team/invites').expect(200);
    expect(list.body.data.find((i: { id: string }) => i.id === inv.body.id).status).toBe(
      'accepted',
    );
  });

  it('accepts as an existing account (with its password) and can switch organisations', async () => {
    const other = await signUp(t.url);
    await owner.agent
      .post('/v1/team/invites')
      .send({ email: other.email, role: 'developer' })
      .expect(201);
    const token = await inviteToken(other.email);
    const anon = request.agent(t.url);
    const wrong = await anon
      .post('/v1/invites/accept')
      .send({ token, password: 'wrong-password' })
      .expect(422);
    expect(wrong.body.errors[0].field).toBe('password');
    const ok = await anon
      .post('/v1/invites/accept')
      .send({ token, password: PASSWORD })
      .expect(200);
    expect(ok.body).toMatchObject({
      role: 'developer',
      organization: { id: owner.organizationId },
    });
    const orgs = await anon.get('/v1/me/organizations').expect(200);
    expect(orgs.body.data).toHaveLength(2);
    const back = await anon
      .post('/v1/me/organization')
      .send({ organizationId: other.organizationId })
      .expect(200);
    expect(back.body.role).toBe('owner');
    await owner.agent
      .post('/v1/team/invites')
      .send({ email: other.email, role: 'admin' })
      .expect(409);
  });

  it('re-sends with a fresh link (the old one dies) and cancels', async () => {
    const email = uniqueEmail('resend');
    const inv = await owner.agent
      .post('/v1/team/invites')
      .send({ email, role: 'developer' })
      .expect(201);
    const first = await inviteToken(email);
    await owner.agent.post('/v1/team/invites').send({ email, role: 'developer' }).expect(409);
    await owner.agent.post(`/v1/team/invites/${inv.body.id}/resend`).expect(200);
    const until = Date.now() + 15000;
    let second = first;
    while (second === first && Date.now() < until) {
      const all = (await (await fetch(`${mail.webUrl}/email`)).json()) as {
        to: { address: string }[];
        text: string;
      }[];
      const tokens = all
        .filter((m) => m.to.some((x) => x.address === email))
        .map((m) => tokenFromText(m.text));
      second = tokens.find((tk) => tk !== first) ?? first;
      if (second === first) await new Promise((r) => setTimeout(r, 200));
    }
    expect(second).not.toBe(first);
    await request(t.url).post('/v1/invites/preview').send({ token: first }).expect(404);
    await request(t.url).post('/v1/invites/preview').send({ token: second }).expect(200);
    const canceled = await owner.agent.delete(`/v1/team/invites/${inv.body.id}`).expect(200);
    expect(canceled.body.status).toBe('canceled');
    await request(t.url).post('/v1/invites/preview').send({ token: second }).expect(404);
  });

  it('changes roles; only owners touch the owner role; the last owner stays', async () => {
    const admin = await addMember(t.url, owner, 'admin', inviteToken);
    const dev = await addMember(t.url, owner, 'developer', inviteToken);
    const changed = await admin.agent
      .patch(`/v1/team/members/${dev.userId}`)
      .send({ role: 'photographer' })
      .expect(200);
    expect(changed.body.role).toBe('photographer');
    expect((await dev.agent.get('/v1/me').expect(200)).body.role).toBe('photographer');
    await dev.agent.get('/v1/keys').expect(403); // the new role applies at once
    await admin.agent.patch(`/v1/team/members/${dev.userId}`).send({ role: 'owner' }).expect(403);
    await admin.agent.patch(`/v1/team/members/${owner.userId}`).send({ role: 'admin' }).expect(403);
    await admin.agent.delete(`/v1/team/members/${owner.userId}`).expect(403);
    await admin.agent
      .post('/v1/team/invites')
      .send({ email: uniqueEmail(), role: 'owner' })
      .expect(403);
    // The only owner cannot step down on their own (nobody changes their own role) or leave.
    await owner.agent.patch(`/v1/team/members/${owner.userId}`).send({ role: 'admin' }).expect(403);
    const last = await owner.agent.delete(`/v1/team/members/${owner.userId}`).expect(409);
    expect(last.body.detail).toMatch(/last owner/);
    await owner.agent
      .patch(`/v1/team/members/${owner.userId}`)
      .send({ role: 'superuser' })
      .expect(422);
    // With a second owner, the first may step down.
    await owner.agent.patch(`/v1/team/members/${admin.userId}`).send({ role: 'owner' }).expect(200);
    await admin.agent.patch(`/v1/team/members/${owner.userId}`).send({ role: 'admin' }).expect(200);
    await admin.agent.patch(`/v1/team/members/${owner.userId}`).send({ role: 'owner' }).expect(200);
    // Removal ends the member's access at once.
    await owner.agent.delete(`/v1/team/members/${dev.userId}`).expect(204);
    await dev.agent.get('/v1/me').expect(401);
  }, 60000);

  it('refuses changing one’s own role with a 403 problem naming userId, and changes nothing', async () => {
    const o = await signUp(t.url, { organizationName: 'Saltmarrow Portrait House' });
    await setPlan(o.organizationId, 'studio');
    const adm = await addMember(t.url, o, 'admin', inviteToken);
    const other = await addMember(t.url, o, 'admin', inviteToken);
    for (const role of ['developer', 'admin', 'owner']) {
      const res = await adm.agent
        .patch(`/v1/team/members/${adm.userId}`)
        .send({ role })
        .expect(403);
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(res.body).toMatchObject({
        type: 'https://lumenwright.test/problems/forbidden',
        title: 'Forbidden',
        status: 403,
        detail: 'You cannot change your own role. Another admin or an owner can change it.',
        errors: [{ field: 'userId', reason: 'is you' }],
        instance: `/v1/team/members/${adm.userId}`,
      });
    }
    // The same id in capitals is still you.
    await adm.agent
      .patch(`/v1/team/members/${adm.userId.toUpperCase()}`)
      .send({ role: 'developer' })
      .expect(403);
    // An owner is refused too, even with a second owner who could take over.
    await o.agent.patch(`/v1/team/members/${other.userId}`).send({ role: 'owner' }).expect(200);
    const mine = await o.agent
      .patch(`/v1/team/members/${o.userId}`)
      .send({ role: 'admin' })
      .expect(403);
    expect(mine.body.detail).toBe(
      'You cannot change your own role. To step down, transfer ownership to another member, or ask another owner to change your role.',
    );
    expect(mine.body.errors).toEqual([{ field: 'userId', reason: 'is you' }]);
    // Nothing changed, and nothing was recorded as a role change of either.
    expect((await adm.agent.get('/v1/me').expect(200)).body.role).toBe('admin');
    expect((await o.agent.get('/v1/me').expect(200)).body.role).toBe('owner');
    const audit = await o.agent.get('/v1/audit?action=member.role_changed').expect(200);
    expect(audit.body.data.map((e: { targetId: string }) => e.targetId)).toEqual([other.userId]);
    // Someone else may: the other owner demotes the first, the first (now admin) changes the admin.
    await other.agent.patch(`/v1/team/members/${o.userId}`).send({ role: 'admin' }).expect(200);
    const changed = await o.agent
      .patch(`/v1/team/members/${adm.userId}`)
      .send({ role: 'developer' })
      .expect(200);
    expect(changed.body.role).toBe('developer');
  }, 60000);

  it('transfers ownership', async () => {
    const o = await signUp(t.url);
    const adm = await addMember(t.url, o, 'admin', inviteToken);
    await o.agent
      .post('/v1/organization/transfer-ownership')
      .send({ userId: adm.userId })
      .expect(204);
    expect((await o.agent.get('/v1/me').expect(200)).body.role).toBe('admin');
    expect((await adm.agent.get('/v1/me').expect(200)).body.role).toBe('owner');
  }, 30000);

  it('keeps an audit log of who did what, from where, paginated', async () => {
    const o = await signUp(t.url);
    const k = await o.agent
      .post('/v1/keys')
      .send({ name: 'audited', environment: 'test' })
      .expect(201);
    await o.agent.post(`/v1/keys/${k.body.id}/rotate`).send({ gracePeriodSeconds: 0 }).expect(201);
    await o.agent.delete(`/v1/keys/${k.body.id}`).expect(200);
    await o.agent
      .post('/v1/team/invites')
      .send({ email: uniqueEmail(), role: 'developer' })
      .expect(201);
    const all = await o.agent.get('/v1/audit?limit=100').expect(200);
    const actions = all.body.data.map((e: { action: string }) => e.action);
    expect(actions.slice(0, 4)).toEqual([
      'invite.created',
      'key.revoked',
      'key.rotated',
      'key.created',
    ]);
    const created = all.body.data.find((e: { action: string }) => e.action === 'key.created');
    expect(created).toMatchObject({
      actor: { userId: o.userId, name: 'Test Owner' },
      targetId: k.body.id,
      ip: '127.0.0.1',
    });
    const p1 = await o.agent.get('/v1/audit?limit=2').expect(200);
    const p2 = await o.agent.get(`/v1/audit?limit=2&cursor=${p1.body.nextCursor}`).expect(200);
    expect([...p1.body.data, ...p2.body.data].map((e: { id: string }) => e.id)).toEqual(
      all.body.data.slice(0, 4).map((e: { id: string }) => e.id),
    );
    const only = await o.agent.get('/v1/audit?action=key.revoked').expect(200);
    expect(only.body.data.map((e: { action: string }) => e.action)).toEqual(['key.revoked']);
    await o.agent.get('/v1/audit?cursor=not-a-cursor').expect(422);
  });
});
