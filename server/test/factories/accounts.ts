// Accounts test helpers: unique people and organisations, signed-in agents, keys, maildev reads.
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent.js';
import type { DataSource } from 'typeorm';
import type { Role } from '../../src/common/decorators/access.decorator.js';
import { openDataSource } from '../setup/db.js';

export const PASSWORD = 'violet-hour-over-the-pier';

export function uniqueEmail(tag = 'user'): string {
  return `${tag}-${randomUUID().slice(0, 8)}@accounts-e2e.test`;
}

export interface SignedInAgent {
  agent: TestAgent;
  email: string;
  userId: string;
  organizationId: string;
  role: Role;
}

/** A new account and organisation; the agent keeps the session cookie. */
export async function signUp(
  url: string,
  overrides: Partial<{
    email: string;
    name: string;
    organizationName: string;
    password: string;
  }> = {},
): Promise<SignedInAgent> {
  const agent = request.agent(url);
  const email = overrides.email ?? uniqueEmail('owner');
  const res = await agent.post('/v1/auth/sign-up').send({
    email,
    password: overrides.password ?? PASSWORD,
    name: overrides.name ?? 'Test Owner',
    organizationName: overrides.organizationName ?? `Studio ${randomUUID().slice(0, 6)}`,
  });
  if (res.status !== 201)
    throw new Error(`sign-up failed: ${res.status} ${JSON.stringify(res.body)}`);
  return {
    agent,
    email,
    userId: res.body.user.id,
    organizationId: res.body.organization.id,
    role: 'owner',
  };
}

/**
 * Puts an organisation on a plan straight in the database, as a payments webhook would (the free
 * plan's 2 seats are too few for tests that need one member per role).
 */
export async function setPlan(organizationId: string, planCode: string): Promise<void> {
  const ds = await openDataSource();
  try {
    await ds.query(`UPDATE organizations SET plan_code = $2 WHERE id = $1`, [
      organizationId,
      planCode,
    ]);
  } finally {
    await ds.destroy();
  }
}

/** Reads the token out of the first link in a text body (`…?token=…`). */
export function tokenFromText(text: string): string {
  const m = /[?&]token=([A-Za-z0-9_%-]+)/.exec(text);
  if (!m) throw new Error(`no token link in: ${text}`);
  return decodeURIComponent(m[1]!);
}

export interface MaildevMessage {
  id: string;
  subject: string;
  text: string;
  html: string;
  to: { address: string }[];
}

/** Polls maildev's REST API until a message to `to` (matching `subject`) arrives. */
export async function waitForMail(
  webUrl: string,
  to: string,
  subject: RegExp,
  timeoutMs = 15000,
): Promise<MaildevMessage> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await fetch(`${webUrl}/email`);
    const all = (await res.json()) as MaildevMessage[];
    const hit = all.find(
      (m) =>
        m.to.some((t) => t.address.toLowerCase() === to.toLowerCase()) && subject.test(m.subject),
    );
    if (hit) return hit;
    if (Date.now() > until)
      throw new Error(`no mail to ${to} matching ${subject} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** Creates a member with `role` in the agent's organisation via invite + accept (mail-free path). */
export async function addMember(
  url: string,
  owner: SignedInAgent,
  role: Role,
  readInviteToken: (email: string) => Promise<string>,
): Promise<SignedInAgent> {
  const email = uniqueEmail(role);
  const inv = await owner.agent.post('/v1/team/invites').send({ email, role });
  if (inv.status !== 201)
    throw new Error(`invite failed: ${inv.status} ${JSON.stringify(inv.body)}`);
  const token = await readInviteToken(email);
  const agent = request.agent(url);
  const acc = await agent
    .post('/v1/invites/accept')
    .send({ token, name: `Test ${role}`, password: PASSWORD });
  if (acc.status !== 200)
    throw new Error(`accept failed: ${acc.status} ${JSON.stringify(acc.body)}`);
  return { agent, email, userId: acc.body.user.id, organizationId: acc.body.organization.id, role };
}

export interface MailInbox {
  smtpUrl: string;
  webUrl: string;
  stop(): Promise<void>;
}

/**
 * Starts a maildev through scripts/lib/maildev.mjs. Jest's CommonJS sandbox cannot load that ES
 * module, so a small Node process does, reports the URLs, and stops maildev on SIGTERM.
 */
export async function startMaildev(): Promise<MailInbox> {
  const { spawn } = await import('node:child_process');
  const path = await import('node:path');
  const lib = path.resolve(__dirname, '../../../scripts/lib/maildev.mjs');
  const code = `import(${JSON.stringify(lib)}).then(async (m) => {
    const h = await m.start();
    process.stdout.write(JSON.stringify({ smtpUrl: h.smtpUrl, webUrl: h.webUrl }) + '\\n');
    const end = async () => { await h.stop(); process.exit(0); };
    process.on('SIGTERM', end); process.stdin.on('end', end); process.stdin.resume();
  }).catch((e) => { console.error(e); process.exit(1); });`;
  const child = spawn(process.execPath, ['-e', code], { stdio: ['pipe', 'pipe', 'inherit'] });
  const info = await new Promise<{ smtpUrl: string; webUrl: string }>((resolve, reject) => {
    let buf = '';
    child.stdout.on('data', (d: Buffer) => {
      buf += d.toString();
      const line = buf.split('\n')[0];
      if (buf.includes('\n') && line) resolve(JSON.parse(line));
    });
    child.once('exit', (c) => reject(new Error(`maildev helper exited (${c})`)));
  });
  return {
    ...info,
    webUrl: `${info.webUrl}/api`,
    stop: () =>
      new Promise<void>((resolve) => {
        if (child.exitCode !== null) return resolve();
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
      }),
  };
}

/**
 * Members straight in the database (no mail, no password hashing per person; they cannot sign
 * in); returns their e-mail addresses.
 */
export async function addMembersDirectly(
  db: DataSource,
  organizationId: string,
  n: number,
  role = 'photographer',
): Promise<string[]> {
  const emails: string[] = [];
  for (let i = 0; i < n; i++) {
    const email = uniqueEmail(role === 'owner' ? 'owner' : 'filler');
    const [u] = await db.query(
      `INSERT INTO users (email, name, password_hash) VALUES ($1, 'Seat Filler', 'x') RETURNING id`,
      [email],
    );
    await db.query(`INSERT INTO memberships (organization_id, user_id, role) VALUES ($1, $2, $3)`, [
      organizationId,
      u.id,
      role,
    ]);
    emails.push(email);
  }
  return emails;
}
