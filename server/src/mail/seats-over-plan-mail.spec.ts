// The seats notice sent after a plan change by webhook: counts read as words (one seat, two
// members), the studio's own name is escaped in the HTML part, and the link is the one given.
import { render } from './templates.js';

describe('seats-over-plan e-mail', () => {
  const base = {
    name: 'Orla Quillmere',
    organizationName: 'Quillmere & Daughters <Dusk>',
    planName: 'Free',
    link: 'http://127.0.0.1:3000/team',
  };

  it('says the plan, its seats, the members and how many to remove, with the Team link', () => {
    const m = render({ template: 'seats-over-plan', data: { ...base, seats: 2, members: 5 } });
    expect(m.subject).toBe('Quillmere & Daughters <Dusk> has more members than its plan has seats');
    expect(m.text).toContain('has changed to Free, which has 2 seats. Your studio has 5 members.');
    expect(m.text).toContain('remove 3 members on the Team page');
    expect(m.text).toContain('\n\nhttp://127.0.0.1:3000/team\n\n');
    expect(m.html).toContain('href="http://127.0.0.1:3000/team"');
    expect(m.html).toContain('Quillmere &amp; Daughters &lt;Dusk&gt;');
    expect(m.html).not.toContain('<Dusk>');
  });

  it('uses the singular for one seat and one member to remove', () => {
    const m = render({ template: 'seats-over-plan', data: { ...base, seats: 1, members: 2 } });
    expect(m.text).toContain('which has 1 seat. Your studio has 2 members.');
    expect(m.text).toContain('remove 1 member on the Team page');
  });
});
