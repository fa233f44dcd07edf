import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { beforeEach, describe, expect, it } from 'vitest';
import { planEveningTimeline, SESSION_PLACEMENTS, type TimelineInput } from '@lumenwright/shared';
import { SessionContext } from '@/lib/session';
import { demoSession, recordFetch, type RecordedCall } from '@/test/api-stub';
import { jsonResponse } from '@/test/responses';
import { clockTime } from '../../utils/format';
import { Playground } from '../playground';
import { PLACEMENT_OPTIONS, toTimelineInput } from './timeline-panel';

let calls: RecordedCall[];

beforeEach(() => {
  // The API answers what the shared planner answers for the same body: the tab then reads
  // "agrees" (the server runs the same function; the e2e tests check the route itself).
  calls = recordFetch((call) => {
    if (call.path === '/v1/health')
      return jsonResponse({ status: 'ok', info: { database: { status: 'up' } } });
    if (call.path === '/v1/timeline' && call.method === 'POST')
      return jsonResponse(planEveningTimeline(call.body as never));
    return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
  });
});

function openTab() {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={queryClient}>
      <SessionContext.Provider value={{ ...demoSession, role: 'photographer' }}>
        <MemoryRouter initialEntries={['/playground?calc=timeline']}>
          <Playground />
        </MemoryRouter>
      </SessionContext.Provider>
    </QueryClientProvider>,
  );
  return screen.findByTestId('timeline-plan');
}

// An invented evening (round-number coordinates): the meal runs into the blue hour.
const form = {
  latitude: 47,
  longitude: 8,
  date: '2026-06-20',
  timeZone: 'Europe/Zurich',
  portraitMinutes: 20,
  setupMinutes: Number.NaN,
  placement: 'earliest' as const,
  lightStands: Number.NaN,
  events: [{ label: 'Dinner', start: '19:30', end: '21:40' }],
};
const calm = { nearRoad: false, nearWater: false, coldFogOrHaze: false, modellingLamps: false };

describe('Evening plan: form to input', () => {
  it('leaves set-up time and stands to the planner when the boxes are empty, keeps events in order', () => {
    const input = toTimelineInput(form, calm);
    expect(input).not.toHaveProperty('setupMinutes');
    expect(input).not.toHaveProperty('lightStands');
    expect(input.events).toEqual(form.events);
    expect(toTimelineInput({ ...form, setupMinutes: 15 }, calm).setupMinutes).toBe(15);
    expect(toTimelineInput({ ...form, lightStands: 0 }, calm).lightStands).toBe(0);
  });

  it('sends the placement and the site conditions, without a wind nobody gave', () => {
    const input = toTimelineInput({ ...form, placement: 'latest' }, { ...calm, nearWater: true });
    expect(input.placement).toBe('latest');
    expect(input.conditions).toEqual({ ...calm, nearWater: true });
    expect(toTimelineInput(form, { ...calm, windKmh: 25 }).conditions?.windKmh).toBe(25);
  });

  it('offers every placement the planner knows, once', () => {
    expect(PLACEMENT_OPTIONS.map((o) => o.value)).toEqual([...SESSION_PLACEMENTS]);
  });
});

describe('Evening plan tab', () => {
  it('shows the best session the planner finds, and the API is asked the same thing', async () => {
    const plan = await openTab();
    const tab = screen.getByRole('tab', { name: 'Evening plan' });
    expect(tab.getAttribute('aria-selected')).toBe('true');
    // The demo evening is today: read the planner's own answer for the body the tab sent.
    await waitFor(() => expect(calls.some((c) => c.path === '/v1/timeline')).toBe(true));
    const sent = calls.find((c) => c.path === '/v1/timeline')!.body;
    const expected = planEveningTimeline(sent as never);
    const best = expected.slots[0];
    const readout = within(plan).getByText('Best session').parentElement!;
    expect(readout.textContent).toContain(
      best ? `${clockTime(best.session.start)}–${clockTime(best.session.end)}` : 'none free',
    );
    // One line per timeline entry, in the planner's order.
    const order = within(plan).getByRole('list', { name: 'The evening in order' });
    const lines = within(order).getAllByRole('listitem');
    expect(lines.map((li) => li.getAttribute('data-kind'))).toEqual(
      expected.timeline.map((e) => e.kind),
    );
    expect(within(plan).getByRole('img', { name: /The evening’s timeline/ })).toBeTruthy();
    await within(screen.getByRole('tabpanel')).findByText('The API agrees with this result');
  });

  it('shows the answer’s cautions, and a site condition ticked above adds its own', async () => {
    const plan = await openTab();
    const shown = () =>
      Array.from(
        within(plan).getByRole('complementary', { name: 'Safety cautions' }).querySelectorAll('li'),
      ).map((li) => li.getAttribute('data-caution'));
    const lastBody = () =>
      calls.filter((c) => c.path === '/v1/timeline').at(-1)?.body as TimelineInput | undefined;
    await waitFor(() => expect(lastBody()).toBeDefined());
    // What the planner answers for the body sent: the dark's cautions and the stands' (2 by default).
    expect(shown()).toEqual(planEveningTimeline(lastBody()!).cautions.map((c) => c.id));
    expect(shown()).toEqual(['stands-wind', 'batteries', 'dark-footing']);
    fireEvent.click(screen.getByRole('checkbox', { name: 'Near water' }));
    await waitFor(() => expect(shown()).toContain('water-at-night'));
    await waitFor(() => expect(lastBody()?.conditions?.nearWater).toBe(true));
    expect(shown()).toEqual(planEveningTimeline(lastBody()!).cautions.map((c) => c.id));
    // No stands: no stand caution.
    fireEvent.change(within(screen.getByRole('tabpanel')).getByLabelText('Light stands'), {
      target: { value: '0' },
    });
    await waitFor(() => expect(shown()).not.toContain('stands-wind'));
    expect(shown()).toContain('dark-footing');
  });

  it('places the session as chosen, and sends the placement to the API', async () => {
    const plan = await openTab();
    const panel = screen.getByRole('tabpanel');
    fireEvent.change(within(panel).getByLabelText('Place the session'), {
      target: { value: 'latest' },
    });
    await waitFor(() =>
      expect(
        calls.some(
          (c) => c.path === '/v1/timeline' && (c.body as TimelineInput).placement === 'latest',
        ),
      ).toBe(true),
    );
    const sent = calls.filter((c) => c.path === '/v1/timeline').at(-1)!.body as TimelineInput;
    const best = planEveningTimeline(sent).slots[0];
    const readout = within(plan).getByText('Best session').parentElement!;
    expect(readout.textContent).toContain(
      best ? `${clockTime(best.session.start)}–${clockTime(best.session.end)}` : 'none free',
    );
  });

  it('names the event field the planner refuses, under that event', async () => {
    await openTab();
    const panel = screen.getByRole('tabpanel');
    const to = within(panel).getAllByLabelText('To')[0]!;
    // Ends before it starts: the shared planner refuses events[0].end.
    fireEvent.change(within(panel).getAllByLabelText('From')[0]!, { target: { value: '17:00' } });
    fireEvent.change(to, { target: { value: '16:30' } });
    const alert = await within(panel).findByRole('alert');
    expect(alert.textContent).toMatch(/^events\[0\]\.end: /);
    expect(to.getAttribute('aria-invalid')).toBe('true');
  });

  it('adds and removes booked events', async () => {
    await openTab();
    const panel = screen.getByRole('tabpanel');
    const count = () => within(panel).getAllByLabelText(/^Event \d+$/).length;
    const before = count();
    fireEvent.click(within(panel).getByRole('button', { name: 'Add an event' }));
    expect(count()).toBe(before + 1);
    fireEvent.click(within(panel).getByRole('button', { name: `Remove event ${before + 1}` }));
    expect(count()).toBe(before);
  });
});
