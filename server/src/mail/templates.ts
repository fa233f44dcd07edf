// E-mail templates: each renders a subject, a plain-text body and an HTML body from plain data.

export interface Rendered {
  subject: string;
  text: string;
  html: string;
}

export type MailTemplate =
  | {
      template: 'invite';
      data: {
        organizationName: string;
        inviterName: string;
        role: string;
        link: string;
        expiresAt: string;
      };
    }
  | { template: 'password-reset'; data: { name: string; link: string; expiresAt: string } }
  | {
      template: 'email-change';
      data: { name: string; newEmail: string; link: string; expiresAt: string };
    }
  | {
      template: 'key-created';
      data: {
        name: string;
        keyName: string;
        prefix: string;
        environment: string;
        organizationName: string;
      };
    }
  | {
      template: 'key-revoked';
      data: {
        name: string;
        keyName: string;
        prefix: string;
        organizationName: string;
        revokedBy: string;
      };
    }
  | { template: 'payment-succeeded'; data: PaymentMailData }
  | { template: 'payment-failed'; data: PaymentMailData }
  | { template: 'seats-over-plan'; data: SeatsOverPlanMailData };

/** Data for the billing e-mails; `amount` is already formatted with its currency. */
export interface PaymentMailData {
  name: string;
  organizationName: string;
  amount: string;
  planName: string;
  invoiceId: string;
  link: string;
  /**
   * Payment failed only: the plan the studio falls back to has fewer seats than its members. The
   * one e-mail then says both things (no separate seats notice is sent for that plan change).
   */
  seats?: SeatsAfterFailedPayment;
  /** Payment failed only: the plan the studio is on until a payment goes through (default Free). */
  fallbackPlanName?: string;
}

/** The plan a failed payment leaves the studio on, when its members no longer fit it. */
export interface SeatsAfterFailedPayment {
  planName: string;
  seats: number;
  members: number;
  /** The console's Team page. */
  teamLink: string;
}

/** Data for the notice that a plan change left the studio with more members than seats. */
export interface SeatsOverPlanMailData {
  name: string;
  organizationName: string;
  planName: string;
  seats: number;
  members: number;
  /** The console's Team page. */
  link: string;
}

const count = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

const esc = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );

function layout(
  title: string,
  paragraphs: string[],
  action?: { label: string; href: string },
): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 16px">${esc(p)}</p>`).join('');
  const button = action
    ? `<p style="margin:24px 0"><a href="${esc(action.href)}" style="background:#1f2a44;color:#ffffff;padding:12px 20px;border-radius:6px;text-decoration:none;display:inline-block">${esc(action.label)}</a></p>` +
      `<p style="margin:0 0 16px;font-size:13px;color:#555">Or paste this address into your browser: ${esc(action.href)}</p>`
    : '';
  return (
    `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${esc(title)}</title></head>` +
    `<body style="font-family:system-ui,sans-serif;color:#1b1b1b;max-width:560px;margin:0 auto;padding:24px">` +
    `<h1 style="font-size:20px">${esc(title)}</h1>${body}${button}` +
    `<p style="margin-top:32px;font-size:12px;color:#666">Lumenwright · sent automatically, replies are not read.</p>` +
    `</body></html>`
  );
}

function text(paragraphs: string[], link?: string): string {
  return [...paragraphs, ...(link ? [link] : []), '', '— Lumenwright (sent automatically)'].join(
    '\n\n',
  );
}

export function render(m: MailTemplate): Rendered {
  switch (m.template) {
    case 'invite': {
      const d = m.data;
      const subject = `You're invited to ${d.organizationName} on Lumenwright`;
      const p = [
        `${d.inviterName} invited you to join ${d.organizationName} as ${d.role}.`,
        `The invitation is valid until ${d.expiresAt}. Open the link to accept it:`,
      ];
      return {
        subject,
        text: text(p, d.link),
        html: layout(subject, p, { label: 'Accept the invitation', href: d.link }),
      };
    }
    case 'password-reset': {
      const d = m.data;
      const subject = 'Reset your Lumenwright password';
      const p = [
        `Hello ${d.name},`,
        `Someone asked to reset the password of this account. The link works once, until ${d.expiresAt}.`,
        'If it was not you, ignore this message: your password stays as it is.',
      ];
      return {
        subject,
        text: text(p, d.link),
        html: layout(subject, p, { label: 'Choose a new password', href: d.link }),
      };
    }
    case 'email-change': {
      const d = m.data;
      const subject = 'Confirm your new Lumenwright e-mail address';
      const p = [
        `Hello ${d.name},`,
        `Confirm that ${d.newEmail} should become the sign-in address of your account. The link works once, until ${d.expiresAt}.`,
      ];
      return {
        subject,
        text: text(p, d.link),
        html: layout(subject, p, { label: 'Confirm the address', href: d.link }),
      };
    }
    case 'key-created': {
      const d = m.data;
      const subject = `New ${d.environment} API key "${d.keyName}" created`;
      const p = [
        `Hello ${d.name},`,
        `A ${d.environment} API key named "${d.keyName}" (${d.prefix}…) was created for ${d.organizationName}.`,
        'If you did not expect this, revoke the key in the console and tell your organisation owner.',
      ];
      return { subject, text: text(p), html: layout(subject, p) };
    }
    case 'key-revoked': {
      const d = m.data;
      const subject = `API key "${d.keyName}" revoked`;
      const p = [
        `Hello ${d.name},`,
        `The API key "${d.keyName}" (${d.prefix}…) of ${d.organizationName} was revoked by ${d.revokedBy}. Requests using it are refused from now on.`,
      ];
      return { subject, text: text(p), html: layout(subject, p) };
    }
    case 'payment-succeeded': {
      const d = m.data;
      const subject = `Payment received for ${d.organizationName}`;
      const p = [
        `Hello ${d.name},`,
        `We received ${d.amount} from ${d.organizationName} for invoice ${d.invoiceId}: ${d.planName}. Thank you.`,
      ];
      return {
        subject,
        text: text(p, d.link),
        html: layout(subject, p, { label: 'See the invoice', href: d.link }),
      };
    }
    case 'payment-failed': {
      const d = m.data;
      const s = d.seats;
      const subject = s
        ? `Payment failed for ${d.organizationName}, which now has more members than seats`
        : `Payment failed for ${d.organizationName}`;
      const collect = `We could not collect ${d.amount} from ${d.organizationName} for invoice ${d.invoiceId}: ${d.planName}.`;
      const p = s
        ? [
            `Hello ${d.name},`,
            collect,
            `Until a payment goes through, the organisation is on the ${s.planName} plan, which has ${count(s.seats, 'seat')}. Your studio has ${count(s.members, 'member')}.`,
            'Everyone keeps their access, but nobody new can be invited or join until a payment goes through or the team fits the plan.',
            `To sort it out, update the payment method on the Billing page to restore the plan, or remove ${count(s.members - s.seats, 'member')} on the Team page: ${s.teamLink}`,
          ]
        : [
            `Hello ${d.name},`,
            collect,
            `Until a payment goes through, the organisation has the ${d.fallbackPlanName ?? 'Free'} plan’s limits. Update the payment method in the console to restore the plan.`,
          ];
      return {
        subject,
        text: text(p, d.link),
        html: layout(subject, p, { label: 'Review billing', href: d.link }),
      };
    }
    case 'seats-over-plan': {
      const d = m.data;
      const over = d.members - d.seats;
      const subject = `${d.organizationName} has more members than its plan has seats`;
      const p = [
        `Hello ${d.name},`,
        `The plan of ${d.organizationName} has changed to ${d.planName}, which has ${count(d.seats, 'seat')}. Your studio has ${count(d.members, 'member')}.`,
        'Everyone keeps their access, but nobody new can be invited or join until the team fits the plan.',
        `To sort it out, remove ${count(over, 'member')} on the Team page, or change to a plan with more seats on the Billing page.`,
      ];
      return {
        subject,
        text: text(p, d.link),
        html: layout(subject, p, { label: 'Open the Team page', href: d.link }),
      };
    }
  }
}
