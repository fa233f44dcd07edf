// The payment-failed e-mail: on its own it says the payment failed; when the plan the studio falls
// back to has fewer seats than its members it says that too, in the same message (one e-mail for
// both causes), with the number to remove and both console pages.
import { render } from './templates.js';

describe('payment-failed e-mail', () => {
  const data = {
    name: 'Tamsin Vellacott',
    organizationName: 'Vellacott <Blue Hour>',
    amount: '29.00 USD',
    planName: 'Studio (monthly plan)',
    invoiceId: 'in_demo_1',
    link: 'http://127.0.0.1:3000/billing',
  };

  it('says only the failed payment when the members fit', () => {
    const m = render({ template: 'payment-failed', data });
    expect(m.subject).toBe('Payment failed for Vellacott <Blue Hour>');
    expect(m.text).toContain(
      'We could not collect 29.00 USD from Vellacott <Blue Hour> for invoice in_demo_1: Studio (monthly plan).',
    );
    expect(m.text).toContain('the organisation has the Free plan’s limits');
    expect(m.text).not.toMatch(/seat/);
    expect(m.html).toContain('href="http://127.0.0.1:3000/billing"');
  });

  it('says the failed payment and the seats in one message when the members do not fit', () => {
    const seats = {
      planName: 'Free',
      seats: 2,
      members: 5,
      teamLink: 'http://127.0.0.1:3000/team',
    };
    const m = render({ template: 'payment-failed', data: { ...data, seats } });
    expect(m.subject).toBe(
      'Payment failed for Vellacott <Blue Hour>, which now has more members than seats',
    );
    expect(m.text).toContain('We could not collect 29.00 USD');
    expect(m.text).toContain(
      'the organisation is on the Free plan, which has 2 seats. Your studio has 5 members.',
    );
    expect(m.text).toContain('nobody new can be invited or join');
    // 5 members − 2 seats = 3 to remove.
    expect(m.text).toContain('remove 3 members on the Team page: http://127.0.0.1:3000/team');
    expect(m.html).toContain('href="http://127.0.0.1:3000/billing"');
    expect(m.html).toContain('Team page: http://127.0.0.1:3000/team');
    expect(m.html).toContain('Vellacott &lt;Blue Hour&gt;');
    expect(m.html).not.toContain('<Blue Hour>');
  });

  it('uses the singular for one seat and one member to remove', () => {
    const seats = { planName: 'Free', seats: 1, members: 2, teamLink: 'http://x.test/team' };
    const m = render({ template: 'payment-failed', data: { ...data, seats } });
    expect(m.text).toContain('which has 1 seat. Your studio has 2 members.');
    expect(m.text).toContain('remove 1 member on the Team page');
  });

  it('names the plan the studio falls back to when it is not Free', () => {
    const m = render({
      template: 'payment-failed',
      data: { ...data, fallbackPlanName: 'Studio' },
    });
    expect(m.text).toContain('the organisation has the Studio plan’s limits');
  });
});
