// Deny by default, role x route, and tenant isolation across every accounts route.
import { METHOD_METADATA, PATH_METADATA } from '@nestjs/common/constants.js';
import { ModulesContainer } from '@nestjs/core';
import request from 'supertest';
import { ACCESS_KEY, AccessRule, Role } from '../../src/common/decorators/access.decorator.js';
import { bootApp, TestApp } from '../setup/app.js';
import {
  addMember,
  MailInbox,
  setPlan,
  signUp,
  SignedInAgent,
  startMaildev,
  tokenFromText,
  uniqueEmail,
  waitForMail,
} from '../factories/accounts.js';

const METHODS = ['GET', 'POST', 'PUT', 'DELETE', 'PATCH', 'ALL', 'OPTIONS', 'HEAD', 'SEARCH'];
const NIL = '00000000-0000-4000-8000-000000000000';

describe('accounts: access decisions', () => {
  let t: TestApp;
  let mail: MailInbox;
  beforeAll(async () => {
    mail = await startMaildev();
    t = await bootApp({ SMTP_URL: mail.smtpUrl });
  }, 90000);
  afterAll(async () => {
    await t?.close();
    await mail?.stop();
  });

  it('every registered route (all modules) carries an explicit access decision', async () => {
    const walked: { route: string; handler: string; rule: AccessRule | undefined }[] = [];
    for (const mod of t.app.get(ModulesContainer).values()) {
      for (const wrapper of mod.controllers.values()) {
        const cls = wrapper.metatype as (new (...a: never[]) => unknown) | null;
        if (!cls) continue;
        const base = String(Reflect.getMetadata(PATH_METADATA, cls) ?? '');
        for (const name of Object.getOwnPropertyNames(cls.prototype)) {
          const fn = (cls.prototype as Record<string, unknown>)[name];
          if (name === 'constructor' || typeof fn !== 'function') continue;
          const method = Reflect.getMetadata(METHOD_METADATA, fn);
          if (method === undefined) continue;
          const rule = Reflect.getMetadata(ACCESS_KEY, fn) ?? Reflect.getMetadata(ACCESS_KEY, cls);
          walked.push({
            route: `${METHODS[method]} /${base}/${Reflect.getMetadata(PATH_METADATA, fn) ?? ''}`,
            handler: name,
            rule,
          });
        }
      }
    }
    const missing = walked.filter(
      (w) => !w.rule || !['public', 'session', 'api-key-or-session'].includes(w.rule.kind),
    );
    expect(missing.map((m) => m.route)).toEqual([]);
    // The walk saw every operation the OpenAPI document lists (operationId = handler name).
    const spec = await request(t.url).get('/openapi.json').expect(200);
    const ops = Object.values(
      spec.body.paths as Record<string, Record<string, { operationId: string }>>,
    ).flatMap((p) => Object.values(p).map((o) => o.operationId));
    const handlers = new Set(walked.map((w) => w.handler));
    expect(ops.filter((op) => !handlers.has(op))).toEqual([]);
    expect(walked.length).toBeGreaterThanOrEqual(30);
  });

  it('refuses every non-public route without credentials (401), whoever owns it', async () => {
    const spec = (await request(t.url).get('/openapi.json').expect(200)).body;
    let checked = 0;
    for (const [path, ops] of Object.entries(
      spec.paths as Record<string, Record<string, { security?: unknown[] }>>,
    )) {
      for (const [method, op] of Object.entries(ops)) {
        if (!op.security?.length) continue; // public routes carry no security requirement
        const url = path.replace(/\{[^}]+\}/g, NIL);
        const res = await (
          request(t.url) as unknown as Record<string, (u: string) => request.Test>
        )[method]!(url).send({});
        expect({ route: `${method.toUpperCase()} ${path}`, status: res.status }).toEqual({
          route: `${method.toUpperCase()} ${path}`,
          status: 401,
        });
        checked++;
      }
    }
    expect(checked).toBeGreaterThanOrEqual(25);
  });

  describe('with a studio holding one member per role, and a second studio', () => {
    const members = {} as Record<Role, SignedInAgent>;
    let outsider: SignedInAgent;
    let fixtures: { keyId: string; inviteId: string; photographerId: string };
    const inviteToken = async (email: string) =>
      tokenFromText((await waitForMail(mail.webUrl, email, /invited/)).text);

    beforeAll(async () => {
      members.owner = await signUp(t.url);
      await setPlan(members.owner.organizationId, 'studio'); // four members and an invitation
      members.admin = await addMember(t.url, members.owner, 'admin', inviteToken);
      members.developer = await addMember(t.url, members.owner, 'developer', inviteToken);
      members.photographer = await addMember(t.url, members.owner, 'photographer', inviteToken);
      outsider = await signUp(t.url);
      const key = await members.owner.agent
        .post('/v1/keys')
        .send({ name: 'studio key', environment: 'live' })
        .expect(201);
      const inv = await members.owner.agent
        .post('/v1/team/invites')
        .send({ email: uniqueEmail('pending'), role: 'developer' })
        .expect(201);
      fixtures = {
        keyId: key.body.id,
        inviteId: inv.body.id,
        photographerId: members.photographer.userId,
      };
    }, 90000);

    // Written from the permission design (not read from the code): who may pass each guard.
    // Requests for allowed roles are shaped to stop harmlessly in the handler (404/422/409).
    const ALL: Role[] = ['owner', 'admin', 'developer', 'photographer'];
    const MATRIX: { call: string; allowed: Role[]; send: (a: SignedInAgent) => request.Test }[] = [
      { call: 'GET /v1/me', allowed: ALL, send: (a) => a.agent.get('/v1/me') },
      {
        call: 'PATCH /v1/me',
        allowed: ALL,
        send: (a) => a.agent.patch('/v1/me').send({ name: '' }),
      },
      {
        call: 'GET /v1/me/organizations',
        allowed: ALL,
        send: (a) => a.agent.get('/v1/me/organizations'),
      },
      {
        call: 'POST /v1/me/organization',
        allowed: ALL,
        send: (a) => a.agent.post('/v1/me/organization').send({ organizationId: NIL }),
      },
      {
        call: 'POST /v1/me/password',
        allowed: ALL,
        send: (a) =>
          a.agent.post('/v1/me/password').send({ currentPassword: 'x', newPassword: '' }),
      },
      {
        call: 'POST /v1/me/email',
        allowed: ALL,
        send: (a) => a.agent.post('/v1/me/email').send({ newEmail: 'bad', password: 'x' }),
      },
      { call: 'GET /v1/whoami', allowed: ALL, send: (a) => a.agent.get('/v1/whoami') },
      { call: 'GET /v1/organization', allowed: ALL, send: (a) => a.agent.get('/v1/organization') },
      {
        call: 'PATCH /v1/organization',
        allowed: ['owner'],
        send: (a) => a.agent.patch('/v1/organization').send({ name: '' }),
      },
      {
        call: 'DELETE /v1/organization',
        allowed: ['owner'],
        send: (a) => a.agent.delete('/v1/organization').send({ confirmName: 'not the name' }),
      },
      {
        call: 'POST /v1/organization/transfer-ownership',
        allowed: ['owner'],
        send: (a) => a.agent.post('/v1/organization/transfer-ownership').send({ userId: NIL }),
      },
      {
        call: 'GET /v1/team/members',
        allowed: ['owner', 'admin'],
        send: (a) => a.agent.get('/v1/team/members'),
      },
      {
        call: 'PATCH /v1/team/members/:userId',
        allowed: ['owner', 'admin'],
        send: (a) => a.agent.patch(`/v1/team/members/${NIL}`).send({ role: 'developer' }),
      },
      {
        call: 'DELETE /v1/team/members/:userId',
        allowed: ['owner', 'admin'],
        send: (a) => a.agent.delete(`/v1/team/members/${NIL}`),
      },
      {
        call: 'GET /v1/team/invites',
        allowed: ['owner', 'admin'],
        send: (a) => a.agent.get('/v1/team/invites'),
      },
      {
        call: 'POST /v1/team/invites',
        allowed: ['owner', 'admin'],
        send: (a) => a.agent.post('/v1/team/invites').send({ email: 'bad', role: 'developer' }),
      },
      {
        call: 'POST /v1/team/invites/:id/resend',
        allowed: ['owner', 'admin'],
        send: (a) => a.agent.post(`/v1/team/invites/${NIL}/resend`),
      },
      {
        call: 'DELETE /v1/team/invites/:id',
        allowed: ['owner', 'admin'],
        send: (a) => a.agent.delete(`/v1/team/invites/${NIL}`),
      },
      {
        call: 'GET /v1/keys',
        allowed: ['owner', 'admin', 'developer'],
        send: (a) => a.agent.get('/v1/keys'),
      },
      {
        call: 'POST /v1/keys',
        allowed: ['owner', 'admin', 'developer'],
        send: (a) => a.agent.post('/v1/keys').send({ name: '', environment: 'test' }),
      },
      {
        call: 'GET /v1/keys/:id',
        allowed: ['owner', 'admin', 'developer'],
        send: (a) => a.agent.get(`/v1/keys/${NIL}`),
      },
      {
        call: 'DELETE /v1/keys/:id',
        allowed: ['owner', 'admin', 'developer'],
        send: (a) => a.agent.delete(`/v1/keys/${NIL}`),
      },
      {
        call: 'POST /v1/keys/:id/rotate',
        allowed: ['owner', 'admin', 'developer'],
        send: (a) => a.agent.post(`/v1/keys/${NIL}/rotate`).send({}),
      },
      { call: 'GET /v1/audit', allowed: ['owner', 'admin'], send: (a) => a.agent.get('/v1/audit') },
    ];

    it.each(ALL)('role %s passes exactly the guards the permission design grants', async (role) => {
      const seen: string[] = [];
      for (const m of MATRIX) {
        const res = await m.send(members[role]);
        const allowed = m.allowed.includes(role);
        seen.push(`${m.call} ${res.status}`);
        expect({ call: m.call, refused: res.status === 403 || res.status === 401 }).toEqual({
          call: m.call,
          refused: !allowed,
        });
      }
      expect(seen).toHaveLength(MATRIX.length);
      // The studio is intact afterwards.
      await members.owner.agent.get('/v1/organization').expect(200);
    });

    it("nothing of one organisation is visible or changeable from another's owner", async () => {
      const o = outsider.agent;
      await o.get(`/v1/keys/${fixtures.keyId}`).expect(404);
      await o.delete(`/v1/keys/${fixtures.keyId}`).expect(404);
      await o.post(`/v1/keys/${fixtures.keyId}/rotate`).send({}).expect(404);
      await o
        .patch(`/v1/team/members/${fixtures.photographerId}`)
        .send({ role: 'admin' })
        .expect(404);
      await o.delete(`/v1/team/members/${fixtures.photographerId}`).expect(404);
      await o.post(`/v1/team/invites/${fixtures.inviteId}/resend`).expect(404);
      await o.delete(`/v1/team/invites/${fixtures.inviteId}`).expect(404);
      await o
        .post('/v1/organization/transfer-ownership')
        .send({ userId: members.admin.userId })
        .expect(404);
      await o
        .post('/v1/me/organization')
        .send({ organizationId: members.owner.organizationId })
        .expect(404);
      const lists = [
        (await o.get('/v1/keys?limit=100').expect(200)).body,
        (await o.get('/v1/team/members').expect(200)).body,
        (await o.get('/v1/team/invites').expect(200)).body,
        (await o.get('/v1/audit?limit=100').expect(200)).body,
        (await o.get('/v1/organization').expect(200)).body,
      ];
      const text = JSON.stringify(lists);
      for (const secret of [
        fixtures.keyId,
        fixtures.inviteId,
        fixtures.photographerId,
        members.owner.organizationId,
        members.admin.email,
      ]) {
        expect(text).not.toContain(secret);
      }
      // And everything is still there for the studio itself.
      const key = await members.owner.agent.get(`/v1/keys/${fixtures.keyId}`).expect(200);
      expect(key.body.status).toBe('active');
      const team = await members.owner.agent.get('/v1/team/members').expect(200);
      expect(
        team.body.data.find((m: { userId: string }) => m.userId === fixtures.photographerId).role,
      ).toBe('photographer');
    });

    it("a key acts only for its own organisation: another studio's key sees its own org", async () => {
      const k = await outsider.agent
        .post('/v1/keys')
        .send({ name: 'outsider', environment: 'test' })
        .expect(201);
      const who = await request(t.url)
        .get('/v1/whoami')
        .set('Authorization', `Bearer ${k.body.secret}`)
        .expect(200);
      expect(who.body.organizationId).toBe(outsider.organizationId);
    });
  });
});
