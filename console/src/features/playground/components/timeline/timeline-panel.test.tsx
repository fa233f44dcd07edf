import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { beforeEach, describe, expect, it } from 'vitest';
import { planEveningTimeline } from '@lumenwright/shared';
import { SessionContext } from '@/lib/session';
import { demoSession, recordFetch, type RecordedCall } from '@/test/api-stub';
import { jsonResponse } from '@/test/responses';
import { clockTime } from '../../utils/format';
import { Playground } from '../playground';
import { toTimelineInput } from './timeline-panel';

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
  events: [{ label: 'Dinner', start: '19:30', end: '21:40' }],
};

describe('Evening plan: form to input', () => {
  it('leaves set-up time to the planner when the box is empty, keeps events in order', () => {
    const input = toTimelineInput(form);
    expect(input).not.toHaveProperty('setupMinutes');
    expect(input.events).toEqual(form.events);
    expect(toTimelineInput({ ...form, setupMinutes: 15 }).setupMinutes).toBe(15);
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
