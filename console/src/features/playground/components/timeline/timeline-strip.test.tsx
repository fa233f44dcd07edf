import { render } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { planEveningTimeline } from '@lumenwright/shared';
import { TimelineStrip } from './timeline-strip';

describe('TimelineStrip', () => {
  it('keeps the time labels at either end inside the frame', () => {
    // An invented evening whose first booked event starts on the half hour, so the first tick
    // sits on the strip's left edge (the planner is the shared one the API runs).
    const result = planEveningTimeline({
      latitude: 52.37,
      longitude: 4.9,
      date: '2026-12-03',
      timeZone: 'Europe/Amsterdam',
      portraitMinutes: 20,
      events: [{ label: 'Ceremony', start: '14:00', end: '14:30' }],
    });
    const { container } = render(<TimelineStrip result={result} />);
    const ticks = [...container.querySelectorAll('text')].filter((t) =>
      /^\d{2}:\d{2}$/.test(t.textContent ?? ''),
    );
    expect(ticks[0]?.textContent).toBe('14:00');
    expect(ticks[0]?.getAttribute('text-anchor')).toBe('start');
    // The ones in between stay centred on their ticks.
    expect(ticks.slice(1, -1).every((t) => t.getAttribute('text-anchor') === 'middle')).toBe(true);
    expect(ticks.length).toBeGreaterThan(3);
  });
});
