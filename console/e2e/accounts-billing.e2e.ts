import { createRequire } from 'node:module';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import {
  baseUrl,
  finishTest,
  openBrowser,
  screenshot,
  signUp,
  uniqueEmail,
  type Session,
} from './browser';

// Team, password reset, audit, billing and test frames through the production console. The mail
// fake (maildev) and the payments fake stand in for the hosted services; `npm test` passes their
// addresses in the environment.

const inboxUrl = (() => {
  const url = process.env.MAIL_INBOX_URL;
  if (!url) throw new Error('MAIL_INBOX_URL is not set (the lead’s npm test sets it)');
  return url.replace(/\/$/, '');
})();

// sharp is a server dependency; resolve it from there rather than adding it to the console.
const requireFromServer = createRequire(new URL('../../server/package.json', import.meta.url));
// require() gives the function itself (the CommonJS build); its type is the ESM default export.
const sharp = requireFromServer('sharp') as (typeof import('sharp'))['default'];

const owner = {
  name: 'Maren Holloway',
  studio: 'Tidewater Lantern Studio',
  email: uniqueEmail('maren'),
};
const member = {
  name: 'Ines Valcourt',
  email: uniqueEmail('ines'),
  firstPassword: 'quayside-afterglow-41',
  newPassword: 'harbour-gloaming-73!',
};

let session: Session;
let page: Page;
/** Failures a test provokes on purpose (exact strings as recorded by openBrowser). */
let expectedErrors: string[] = [];

interface MailMessage {
  subject: string;
  text?: string;
  html?: string;
  to: { address: string; name?: string }[];
}

const escapeRegExp = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

/** Polls the mail fake's REST API until a message to `to` holds a link starting with `prefix`. */
async function linkFromMail(to: string, prefix: string, timeoutMs = 20_000): Promise<string> {
  const pattern = new RegExp(`${escapeRegExp(prefix)}[A-Za-z0-9_~.%-]+`);
  const until = Date.now() + timeoutMs;
  for (;;) {
    const response = await fetch(`${inboxUrl}/api/email`);
    expect(response.status).toBe(200);
    const messages = (await response.json()) as MailMessage[];
    for (const message of messages) {
      if (!message.to.some((r) => r.address.toLowerCase() === to.toLowerCase())) continue;
      const found = pattern.exec(message.text ?? '') ?? pattern.exec(message.html ?? '');
      if (found) return found[0];
    }
    if (Date.now() > until) throw new Error(`no mail to ${to} with a link ${prefix}…`);
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
}

/** Navigation entries the signed-in role can see. */
async function navLabels(target: Page): Promise<string[]> {
  const nav = target.getByRole('navigation', { name: 'Primary' });
  await nav.getByRole('link', { name: 'Overview' }).waitFor();
  return (await nav.getByRole('link').allTextContents()).map((label) => label.trim());
}

/** Filters the Audit page by an action and returns the rows' text. */
async function auditRows(action: string): Promise<string[]> {
  await page.goto(`${baseUrl}/audit`);
  await page.getByRole('heading', { level: 1, name: 'Audit' }).waitFor();
  const field = page.getByLabel('Action');
  await field.fill(action);
  await field.press('Enter');
  await page.waitForURL(new RegExp(`action=${escapeRegExp(action)}`));
  const table = page.getByRole('table', { name: 'Audit events' });
  await table.waitFor();
  await table.locator('tbody tr').first().waitFor();
  // The previous (unfiltered) page can stay on screen while the filtered one loads: wait until
  // every row shows the action asked for.
  await page.waitForFunction((wanted) => {
    const table = [...document.querySelectorAll('table')].find(
      (t) => t.querySelector('caption')?.textContent === 'Audit events',
    );
    const codes = [...(table?.querySelectorAll('tbody code') ?? [])];
    return codes.length > 0 && codes.every((c) => c.textContent === wanted);
  }, action);
  return table.locator('tbody tr').allTextContents();
}

/**
 * A uniform patch lit by CIE standard illuminant D65: chromaticity x = 0.31271, y = 0.32902
 * (CIE 15:2004, Colorimetry, 3rd ed.), at luminance Y = 0.2. xy → XYZ, then the
 * XYZ → linear sRGB matrix and the sRGB transfer function of IEC 61966-2-1:1999, then 8 bits.
 */
function d65Srgb8(): { r: number; g: number; b: number } {
  const x = 0.31271;
  const y = 0.32902;
  const Y = 0.2;
  const X = (x / y) * Y;
  const Z = ((1 - x - y) / y) * Y;
  const linear = [
    3.2406 * X - 1.5372 * Y - 0.4986 * Z,
    -0.9689 * X + 1.8758 * Y + 0.0415 * Z,
    0.0557 * X - 0.204 * Y + 1.057 * Z,
  ];
  const encode = (c: number) => {
    const v = Math.min(1, Math.max(0, c));
    const gamma = v <= 0.0031308 ? 12.92 * v : 1.055 * v ** (1 / 2.4) - 0.055;
    return Math.round(gamma * 255);
  };
  const [r, g, b] = linear.map(encode) as [number, number, number];
  return { r, g, b };
}

beforeAll(async () => {
  session = await openBrowser();
  page = session.page;
  await signUp(page, owner);
});

afterAll(async () => {
  await session?.close();
});

afterEach(async (context) => {
  const expected = expectedErrors;
  expectedErrors = [];
  await finishTest(session, `ab-${context.task.name}`, expected);
});

describe('accounts and billing in a real browser', () => {
  it('invites a photographer by mail; they join and see only what the role allows', async () => {
    await page.goto(`${baseUrl}/team`);
    await page.getByRole('heading', { level: 1, name: 'Team' }).waitFor();
    await page.getByLabel('Email', { exact: true }).fill(member.email);
    await page.getByLabel('Role', { exact: true }).selectOption('photographer');
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByText(`Invitation sent to ${member.email}`).waitFor();
    const inviteRow = page
      .getByRole('table', { name: 'Invitations' })
      .getByRole('row', { name: new RegExp(escapeRegExp(member.email)) });
    await inviteRow.getByText('pending').waitFor();
    await expect(inviteRow.textContent()).resolves.toContain('photographer');

    const link = await linkFromMail(member.email, `${baseUrl}/accept-invite?token=`);
    const guest = await openBrowser();
    try {
      await guest.page.goto(link);
      await guest.page.getByRole('heading', { level: 1, name: 'Join a studio' }).waitFor();
      await guest.page.getByText(`invites ${member.email} to join as photographer`).waitFor();
      await guest.page.getByLabel('Your name').fill(member.name);
      await guest.page.getByLabel('Choose a password').fill(member.firstPassword);
      await guest.page.getByRole('button', { name: `Join ${owner.studio}` }).click();
      await guest.page.getByRole('heading', { level: 1, name: 'Overview' }).waitFor();
      const menu = guest.page.getByRole('button', { name: new RegExp(member.name) });
      await expect(menu.textContent()).resolves.toContain(`${owner.studio} · photographer`);

      const labels = await navLabels(guest.page);
      expect(labels).toContain('Playground');
      expect(labels).toContain('Setups');
      for (const hidden of ['Keys', 'Team', 'Audit', 'Billing'])
        expect(labels).not.toContain(hidden);
      // Typing the address of a section the role lacks explains instead of failing.
      await guest.page.goto(`${baseUrl}/keys`);
      await guest.page.getByText('Your role in this studio doesn’t include this section').waitFor();
      await screenshot(guest.page, 'ab-photographer-keys-refused');
      expect(guest.errors).toEqual([]);
    } finally {
      await guest.close();
    }

    await page.goto(`${baseUrl}/team`);
    const memberRow = page
      .getByRole('table', { name: 'Members' })
      .getByRole('row', { name: new RegExp(escapeRegExp(member.email)) });
    await memberRow.waitFor();
    await expect(memberRow.getByLabel(`Role of ${member.name}`).inputValue()).resolves.toBe(
      'photographer',
    );
  });

  it('resets a forgotten password from the mailed link and signs in with the new one', async () => {
    const guest = await openBrowser();
    try {
      const signInCall = `http 401: POST ${baseUrl}/v1/auth/sign-in`;
      await guest.page.goto(`${baseUrl}/sign-in`);
      await guest.page.getByRole('link', { name: 'Forgot your password?' }).click();
      await guest.page.getByRole('heading', { level: 1, name: 'Forgot your password?' }).waitFor();
      await guest.page.getByLabel('Email', { exact: true }).fill(member.email);
      await guest.page.getByRole('button', { name: 'Send the link' }).click();
      await guest.page.getByText('a link to choose a new password is on its way').waitFor();

      const link = await linkFromMail(member.email, `${baseUrl}/reset-password?token=`);
      await guest.page.goto(link);
      await guest.page.getByRole('heading', { level: 1, name: 'Choose a new password' }).waitFor();
      await guest.page.getByLabel('New password', { exact: true }).fill(member.newPassword);
      await guest.page.getByLabel('Repeat the new password').fill(member.newPassword);
      await guest.page.getByRole('button', { name: 'Set the password' }).click();
      await guest.page.getByText('Your password is changed.').waitFor();
      await guest.page.getByRole('link', { name: 'Sign in' }).click();
      await guest.page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();

      // The old password no longer works...
      await guest.page.getByLabel('Email', { exact: true }).fill(member.email);
      await guest.page.getByLabel('Password').fill(member.firstPassword);
      await guest.page.getByRole('button', { name: 'Sign in' }).click();
      await guest.page.getByRole('alert').filter({ hasText: 'password is wrong' }).waitFor();
      await expect(
        guest.page.getByRole('heading', { level: 1, name: 'Sign in' }).isVisible(),
      ).resolves.toBe(true);
      // ...the new one does.
      await guest.page.getByLabel('Password').fill(member.newPassword);
      await guest.page.getByRole('button', { name: 'Sign in' }).click();
      await guest.page.getByRole('heading', { level: 1, name: 'Overview' }).waitFor();
      const menu = guest.page.getByRole('button', { name: new RegExp(member.name) });
      await expect(menu.textContent()).resolves.toContain('photographer');
      await screenshot(guest.page, 'ab-signed-in-after-reset');
      expect(guest.errors.filter((error) => error !== signInCall)).toEqual([]);
      expect(guest.errors).toContain(signInCall);
    } finally {
      await guest.close();
    }
  });

  it('shows the owner the invitation, the reset and the sign-ins in the audit log', async () => {
    const invites = await auditRows('invite.created');
    expect(invites.some((row) => row.includes(owner.name))).toBe(true);
    const accepted = await auditRows('invite.accepted');
    expect(accepted.length).toBeGreaterThan(0);
    const resets = await auditRows('auth.password_reset');
    expect(resets.some((row) => row.includes(member.name))).toBe(true);
    const signIns = await auditRows('auth.sign_in');
    expect(signIns.some((row) => row.includes(member.name))).toBe(true);
    // Filtering is exact: a sign-in row never shows another action.
    await expect(
      page.getByRole('table', { name: 'Audit events' }).locator('tbody code').allTextContents(),
    ).resolves.toEqual(signIns.map(() => 'auth.sign_in'));
  });

  it('upgrades to the studio plan through the hosted checkout and sees the new quota', async () => {
    const plans = await page.request.get(`${baseUrl}/v1/plans`);
    expect(plans.status()).toBe(200);
    const studio = (
      (await plans.json()) as {
        data: { code: string; name: string; includedCallsPerMonth: number }[];
      }
    ).data.find((plan) => plan.code === 'studio');
    expect(studio).toBeDefined();

    await page.goto(`${baseUrl}/billing`);
    await page.getByRole('heading', { level: 1, name: 'Billing' }).waitFor();
    await page.getByRole('button', { name: `Upgrade to ${studio!.name}` }).click();
    // The payments fake's own page, on its own origin.
    await page.getByRole('button', { name: 'Approve payment' }).waitFor();
    const checkoutOrigin = new URL(page.url()).origin;
    expect(checkoutOrigin).not.toBe(baseUrl);
    await expect(page.title()).resolves.toBe('Confirm your subscription');
    await screenshot(page, 'ab-hosted-checkout');
    expectedErrors = [`http 404: GET ${checkoutOrigin}/favicon.ico`];
    await page.getByRole('button', { name: 'Approve payment' }).click();
    await page.waitForURL(`${baseUrl}/billing?checkout=complete**`);
    await page.getByText('Payment approved.').waitFor();

    // The plan changes when the payment webhook lands; reload as a person would until it shows.
    const studioCard = page.getByRole('article').filter({
      has: page.getByRole('heading', { level: 3, name: new RegExp(`^${studio!.name}`) }),
    });
    const until = Date.now() + 20_000;
    for (;;) {
      await studioCard.waitFor();
      if (await studioCard.getByText('(current)').isVisible()) break;
      if (Date.now() > until) throw new Error('the studio plan never became current');
      await page.waitForTimeout(500);
      await page.reload();
    }
    const quota = studio!.includedCallsPerMonth.toLocaleString('en-US');
    await studioCard.getByText(`${quota} live calls a month`).waitFor();
    await page.getByText(/^Subscription active. The current billing period ends/).waitFor();

    await page.goto(`${baseUrl}/`);
    await page.getByRole('heading', { level: 1, name: 'Overview' }).waitFor();
    await page
      .getByText(`billable calls of ${quota} included in the ${studio!.name} plan`)
      .waitFor();
  });

  it('measures an uploaded D65 test frame at about 6504 K', async () => {
    const colour = d65Srgb8();
    const png = await sharp({
      create: { width: 320, height: 240, channels: 3, background: colour },
    })
      .png()
      .toBuffer();

    await page.goto(`${baseUrl}/frames`);
    await page.getByRole('heading', { level: 1, name: 'Test frames' }).waitFor();
    await page
      .locator('input[type="file"]')
      .setInputFiles({ name: 'd65-patch.png', mimeType: 'image/png', buffer: png });
    const preview = page.getByRole('img', { name: /Preview of the test frame/ });
    await preview.waitFor();
    await page.waitForFunction(
      () => (document.querySelector('img[alt^="Preview"]') as HTMLImageElement | null)?.complete,
    );
    // Mark the middle of the frame as the neutral patch.
    const box = (await preview.boundingBox())!;
    await page.mouse.move(box.x + box.width * 0.25, box.y + box.height * 0.25);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width * 0.5, box.y + box.height * 0.5, { steps: 4 });
    await page.mouse.move(box.x + box.width * 0.75, box.y + box.height * 0.75, { steps: 4 });
    await page.mouse.up();
    await page.getByText(/^Patch: \d+ × \d+ px at \(\d+, \d+\)$/).waitFor();

    await page.getByRole('button', { name: 'Upload and measure' }).click();
    const result = page.getByTestId('frame-result');
    await result.waitFor();
    await result.getByText('as you marked it').waitFor();
    // The upload joins the recent frames with its server-made thumbnail.
    const recent = page.getByRole('region', { name: 'Recent frames' });
    await recent.getByText(/^d65-patch\.png · \d+ K$/).waitFor();
    // The frame shown above is the one marked among the recent frames.
    await expect(
      recent.getByRole('button', { name: /^d65-patch\.png/ }).getAttribute('aria-pressed'),
    ).resolves.toBe('true');
    await page.waitForFunction(
      () => {
        const thumb = document.querySelector<HTMLImageElement>(
          '[aria-labelledby="recent-frames-heading"] img',
        );
        return thumb?.complete === true && thumb.naturalWidth > 0;
      },
      undefined,
      { timeout: 10_000 },
    );
    const cctText =
      (await result
        .locator('dt', { hasText: /^CCT$/ })
        .locator('xpath=following-sibling::dd')
        .textContent()) ?? '';
    const cct = Number(cctText.replace(/[^\d.]/g, ''));
    // D65's correlated colour temperature is about 6504 K (CIE 15:2004); ±150 K covers 8-bit rounding.
    expect(cct).toBeGreaterThan(6504 - 150);
    expect(cct).toBeLessThan(6504 + 150);
    await expect(
      result
        .locator('dt', { hasText: /^Tint$/ })
        .locator('xpath=following-sibling::dd')
        .textContent(),
    ).resolves.toBe('none');
    // A neutral patch needs no correction, and says so without a signed zero ("-0 mired").
    await expect(result.textContent()).resolves.not.toMatch(/[+-]0(?![.\d])/);
  });
});
