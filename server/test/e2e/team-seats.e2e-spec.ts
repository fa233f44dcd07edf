// Team seats: members plus pending invitations stay within the plan's seats (invitations, re-sends
// and acceptances, also when they race), expired invitations free their seat, a smaller plan asked
// for from the console is refused while the members do not fit, and one that arrives by webhook
// keeps everyone but lets nobody new in (and tells the owners by e-mail, once). Free plan: 2 seats;
// Studio: 10; Platform: 50.
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { PLAN_CATALOGUE } from '../../src/plans/plan-catalogue.js';
import {
  addMembersDirectly,
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
import { eventually, fakeApi, planOf, studioByCheckout } from '../factories/billing.js';
import { startFake, type RunningFake } from '../factories/frames.js';
import { bootApp, TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';

const seatsOf = (code: string) => PLAN_CATALOGUE.find((p) => p.code === code)!.seats;
const PUBLIC_URL = 'http://127.0.0.1:3997';

describe('team seats', () => {
  let t: TestApp;
  let mail: MailInbox;
  let payments: RunningFake;
  let db: DataSource;

  beforeAll(async () => {
    mail = await startMaildev();
    payments = await startFake('payments-fake');
    t = await bootApp({ ...payments.env, SMTP_URL: mail.smtpUrl, PUBLIC_URL });
    db = await openDataSource();
  }, 90000);
  afterAll(async () => {
    await db?.destroy();
    await t?.close();
    await payments?.stop();
    await mail?.stop();
  });

  const invite = (o: SignedInAgent, email = uniqueEmail('seat'), role = 'photographer') =>
    o.agent.post('/v1/team/invites').send({ email, role });
  const tokenFor = async (email: string) =>
    tokenFromText((await waitForMail(mail.webUrl, email, /invited/)).text);
  const accept = (token: string, name = 'Seat Taker') =>
    request(t.url).post('/v1/invites/accept').send({ token, name, password: PASSWORD });
  const seats = async (o: SignedInAgent) =>
    (await o.agent.get('/v1/team/members').expect(200)).body.seats;
  const memberCount = async (orgId: string) =>
    (
      await db.query(`SELECT count(*)::int AS n FROM memberships WHERE organization_id = $1`, [
        orgId,
      ])
    )[0].n as number;
  /** The payments fake's cancellation event for the organisation, once our server answered it 2xx. */
  const deliveredCancellation = async (orgId: string) => {
    const event = await eventually(async () => {
      const events = (await fakeApi(payments, 'GET', '/_fake/events')).data as {
        id: string;
        type: string;
        data: { object: { metadata?: { organization_id?: string } } };
        deliveries: { delivered: boolean }[];
      }[];
      return events.find(
        (e) =>
          e.type === 'customer.subscription.deleted' &&
          e.data.object.metadata?.organization_id === orgId &&
          e.deliveries.length > 0 &&
          e.deliveries.every((d) => d.delivered),
      );
    });
    return event!;
  };
  const seatsMailJobs = (to: string[]) =>
    db.query(
      `SELECT data->>'to' AS to FROM pgboss.job
        WHERE name = 'mail' AND data->>'template' = 'seats-over-plan' AND data->>'to' = ANY($1)`,
      [to],
    ) as Promise<{ to: string }[]>;

  it('refuses an invitation when members and pending invitations fill the seats, with a 409 problem', async () => {
    expect(seatsOf('free')).toBe(2); // plan-catalogue.ts
    const o = await signUp(t.url);
    expect(await seats(o)).toEqual({
      limit: 2,
      used: 1,
      members: 1,
      pendingInvites: 0,
      planCode: 'free',
      planName: 'Free',
    });
    const first = await invite(o).expect(201);
    const refusedEmail = uniqueEmail('refused');
    const refused = await invite(o, refusedEmail).expect(409);
    expect(refused.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(refused.body).toMatchObject({
      type: 'https://lumenwright.test/problems/conflict',
      title: 'Conflict',
      status: 409,
      detail:
        'Your plan has 2 seats: 1 member and 1 pending invite. Remove a member, cancel an invite or change plan.',
      limit: 'seats',
      limitValue: 2,
      count: 2,
      members: 1,
      pendingInvites: 1,
      planCode: 'free',
      instance: '/v1/team/invites',
    });
    // Nothing was written for the refused address.
    const rows = await db.query(`SELECT id FROM invites WHERE email = $1`, [refusedEmail]);
    expect(rows).toHaveLength(0);
    expect(await seats(o)).toMatchObject({ limit: 2, used: 2, members: 1, pendingInvites: 1 });
    const current = await o.agent.get('/v1/plans/current').expect(200);
    expect(current.body.plan.features.seats).toBe(2);
    expect(current.body.usage).toMatchObject({ seatsUsed: 2, members: 1, pendingInvites: 1 });
    // Cancelling the pending invitation frees its seat.
    await o.agent.delete(`/v1/team/invites/${first.body.id}`).expect(200);
    await invite(o, refusedEmail).expect(201);
  });

  it('counts no expired invitation; re-sending one takes a seat again only if one is free', async () => {
    const o = await signUp(t.url);
    const old = await invite(o).expect(201);
    await db.query(`UPDATE invites SET expires_at = now() - interval '1 minute' WHERE id = $1`, [
      old.body.id,
    ]);
    expect(await seats(o)).toMatchObject({ used: 1, members: 1, pendingInvites: 0 });
    const fresh = await invite(o).expect(201);
    expect(await seats(o)).toMatchObject({ used: 2, pendingInvites: 1 });
    const resent = await o.agent.post(`/v1/team/invites/${old.body.id}/resend`).expect(409);
    expect(resent.body).toMatchObject({ limit: 'seats', limitValue: 2, count: 2 });
    const still = await db.query(
      `SELECT expires_at < now() AS expired FROM invites WHERE id = $1`,
      [old.body.id],
    );
    expect(still[0].expired).toBe(true);
    // Re-sending a pending invitation needs no new seat.
    await o.agent.post(`/v1/team/invites/${fresh.body.id}/resend`).expect(200);
    await o.agent.delete(`/v1/team/invites/${fresh.body.id}`).expect(200);
    const back = await o.agent.post(`/v1/team/invites/${old.body.id}/resend`).expect(200);
    expect(back.body.status).toBe('pending');
    expect(await seats(o)).toMatchObject({ used: 2, pendingInvites: 1 });
  });

  it('refuses to accept when the members fill the seats (plan lowered since), writing nothing', async () => {
    const o = await signUp(t.url, { organizationName: 'Gloamwick Portrait Rooms' });
    await setPlan(o.organizationId, 'studio');
    const [a, b] = [uniqueEmail('first'), uniqueEmail('second')];
    await invite(o, a).expect(201);
    await invite(o, b).expect(201);
    await accept(await tokenFor(a)).expect(200);
    await setPlan(o.organizationId, 'free'); // 2 seats, 2 members, 1 pending invitation
    const token = await tokenFor(b);
    const refused = await accept(token).expect(409);
    expect(refused.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(refused.body).toMatchObject({
      status: 409,
      limit: 'seats',
      limitValue: 2,
      members: 2,
      pendingInvites: 1,
      planCode: 'free',
    });
    expect(refused.body.detail).toMatch(
      /^Gloamwick Portrait Rooms has no free seat: its plan has 2 seats and 2 members\./,
    );
    // No account, no membership, and the invitation can still be used.
    expect(await db.query(`SELECT id FROM users WHERE email = $1`, [b])).toHaveLength(0);
    expect(await memberCount(o.organizationId)).toBe(2);
    const list = await o.agent.get('/v1/team/invites').expect(200);
    expect(list.body.data.find((i: { email: string }) => i.email === b).status).toBe('pending');
    expect(refused.headers['set-cookie']).toBeUndefined();
    // An existing account is refused the same way.
    const other = await signUp(t.url);
    await setPlan(o.organizationId, 'studio');
    await invite(o, other.email).expect(201);
    await setPlan(o.organizationId, 'free');
    const existing = await other.agent
      .post('/v1/invites/accept')
      .send({ token: await tokenFor(other.email) })
      .expect(409);
    expect(existing.body.limit).toBe('seats');
    expect(await memberCount(o.organizationId)).toBe(2);
    // A seat freed: the same link works.
    const members = (await o.agent.get('/v1/team/members').expect(200)).body.data as {
      userId: string;
      email: string;
    }[];
    await o.agent
      .delete(`/v1/team/members/${members.find((m) => m.email === a)!.userId}`)
      .expect(204);
    const ok = await accept(token).expect(200);
    expect(ok.body).toMatchObject({ organization: { id: o.organizationId }, user: { email: b } });
    expect(await seats(o)).toMatchObject({ limit: 2, used: 3, members: 2, pendingInvites: 1 });
  }, 60000);

  it('gives the last seat to exactly one of several acceptances racing for it', async () => {
    const o = await signUp(t.url);
    await setPlan(o.organizationId, 'studio');
    const emails = [uniqueEmail('racer'), uniqueEmail('racer'), uniqueEmail('racer')];
    for (const e of emails) await invite(o, e).expect(201);
    const tokens = await Promise.all(emails.map(tokenFor));
    await setPlan(o.organizationId, 'free'); // one free seat, three pending invitations
    const results = await Promise.all(tokens.map((tk, i) => accept(tk, `Racer ${i}`)));
    const statuses = results.map((r) => r.status).sort();
    expect(statuses).toEqual([200, 409, 409]);
    for (const r of results.filter((x) => x.status === 409)) expect(r.body.limit).toBe('seats');
    expect(await memberCount(o.organizationId)).toBe(2);
    // The two refused have no account either.
    const accounts = await db.query(`SELECT email FROM users WHERE email = ANY($1)`, [emails]);
    expect(accounts).toHaveLength(1);
  }, 60000);

  it('gives the last seat to exactly one of several invitations sent at once', async () => {
    const o = await signUp(t.url);
    const results = await Promise.all([1, 2, 3, 4].map(() => invite(o)));
    expect(results.map((r) => r.status).sort()).toEqual([201, 409, 409, 409]);
    expect(await seats(o)).toMatchObject({ limit: 2, used: 2, pendingInvites: 1 });
  });

  it('refuses a console downgrade to fewer seats than members, saying how many to remove', async () => {
    const o = await signUp(t.url);
    await setPlan(o.organizationId, 'platform');
    await addMembersDirectly(db, o.organizationId, 11); // 12 members
    expect(seatsOf('studio')).toBe(10);
    const refused = await o.agent
      .post('/v1/billing/checkout')
      .send({ planCode: 'studio' })
      .expect(409);
    expect(refused.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(refused.body).toMatchObject({
      status: 409,
      detail:
        'The Studio plan has 10 seats and your studio has 12 members. Remove 2 members before changing to Studio.',
      limit: 'seats',
      limitValue: 10,
      members: 12,
      removeMembers: 2,
      planCode: 'studio',
      errors: [{ field: 'planCode', reason: 'has 10 seats, fewer than your members' }],
    });
    const checkouts = await db.query(
      `SELECT id FROM billing_checkouts WHERE organization_id = $1`,
      [o.organizationId],
    );
    expect(checkouts).toHaveLength(0);
    // Two fewer members: the same change is allowed.
    await db.query(
      `DELETE FROM memberships WHERE id IN (SELECT id FROM memberships
        WHERE organization_id = $1 AND role = 'photographer' LIMIT 2)`,
      [o.organizationId],
    );
    const ok = await o.agent.post('/v1/billing/checkout').send({ planCode: 'studio' }).expect(201);
    expect(ok.body).toMatchObject({ planCode: 'studio', change: 'downgrade' });
  });

  it('applies a downgrade from the payments webhook: everyone stays, nobody new joins', async () => {
    const o = await signUp(t.url);
    await studioByCheckout(o);
    const pendingEmail = uniqueEmail('pending');
    await invite(o, pendingEmail).expect(201);
    await addMembersDirectly(db, o.organizationId, 3); // 4 members, 1 pending invitation
    // Cancelling is never refused for seats; the webhook moves the studio to free (2 seats).
    await o.agent.post('/v1/billing/cancel').expect(202);
    await eventually(async () => (await planOf(o)) === 'free');
    expect(await memberCount(o.organizationId)).toBe(4);
    expect(await seats(o)).toEqual({
      limit: 2,
      used: 5,
      members: 4,
      pendingInvites: 1,
      planCode: 'free',
      planName: 'Free',
    });
    const refused = await invite(o).expect(409);
    expect(refused.body).toMatchObject({ limit: 'seats', limitValue: 2, count: 5 });
    expect(refused.body.detail).toBe(
      'Your plan has 2 seats: 4 members and 1 pending invite. Remove a member, cancel an invite or change plan.',
    );
    await accept(await tokenFor(pendingEmail)).expect(409);
    // Every member still signs in to the studio (the owner's session still works).
    await o.agent.get('/v1/team/members').expect(200);
  }, 60000);
  it('e-mails each owner once when a webhook moves the studio to fewer seats than members', async () => {
    const o = await signUp(t.url, {
      name: 'Isolde Fenmarsh',
      organizationName: 'Fenmarsh Twilight Rooms',
    });
    await studioByCheckout(o);
    const [coOwner] = await addMembersDirectly(db, o.organizationId, 1, 'owner');
    const shooters = await addMembersDirectly(db, o.organizationId, 2); // 4 members, 10 seats
    await o.agent.post('/v1/billing/cancel').expect(202);
    await eventually(async () => (await planOf(o)) === 'free');
    expect(seatsOf('free')).toBe(2); // plan-catalogue.ts
    const subject = /^Fenmarsh Twilight Rooms has more members than its plan has seats$/;
    for (const to of [o.email, coOwner!]) {
      const msg = await waitForMail(mail.webUrl, to, subject);
      expect(msg.text).toContain(
        'The plan of Fenmarsh Twilight Rooms has changed to Free, which has 2 seats. Your studio has 4 members.',
      );
      expect(msg.text).toContain('nobody new can be invited or join until the team fits the plan');
      expect(msg.text).toContain(
        'remove 2 members on the Team page, or change to a plan with more seats on the Billing page',
      );
      expect(msg.text).toContain(`${PUBLIC_URL}/team`);
      expect(msg.html).toContain(`href="${PUBLIC_URL}/team"`);
    }
    expect(
      (await waitForMail(mail.webUrl, o.email, subject)).text.startsWith('Hello Isolde Fenmarsh,'),
    ).toBe(true);
    const event = await deliveredCancellation(o.organizationId);
    const [row] = await db.query(`SELECT outcome FROM billing_events WHERE id = $1`, [event.id]);
    expect(row.outcome).toBe(
      'subscription canceled; organisation on free; 4 members over 2 seats (owners get an e-mail)',
    );
    // Only owners are written to.
    const everyone = [o.email, coOwner!, ...shooters];
    expect((await seatsMailJobs(everyone)).map((j) => j.to).sort()).toEqual(
      [o.email, coOwner!].sort(),
    );
    // The payments service delivers the same event again: a duplicate, and no second e-mail.
    await fakeApi(payments, 'POST', `/_fake/events/${event.id}/resend`);
    const [again] = await db.query(`SELECT outcome FROM billing_events WHERE id = $1`, [event.id]);
    expect(again.outcome).toBe(row.outcome);
    expect(await seatsMailJobs(everyone)).toHaveLength(2);
    await new Promise((r) => setTimeout(r, 1500)); // a second message would have arrived by now
    const inbox = (await (await fetch(`${mail.webUrl}/email`)).json()) as {
      subject: string;
      to: { address: string }[];
    }[];
    const notices = inbox.filter(
      (m) => subject.test(m.subject) && m.to.some((x) => everyone.includes(x.address)),
    );
    expect(notices.map((m) => m.to[0]!.address).sort()).toEqual([o.email, coOwner!].sort());
  }, 60000);

  it('sends no seats e-mail when the members still fit the smaller plan', async () => {
    const o = await signUp(t.url);
    await studioByCheckout(o);
    const [other] = await addMembersDirectly(db, o.organizationId, 1); // 2 members: Free's 2 seats
    await o.agent.post('/v1/billing/cancel').expect(202);
    await eventually(async () => (await planOf(o)) === 'free');
    const event = await deliveredCancellation(o.organizationId);
    const [row] = await db.query(`SELECT outcome FROM billing_events WHERE id = $1`, [event.id]);
    expect(row.outcome).toBe('subscription canceled; organisation on free');
    expect(await seatsMailJobs([o.email, other!])).toEqual([]);
  }, 60000);
});
