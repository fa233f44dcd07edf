import { fireEvent, render, screen, within } from '@testing-library/react';
import { planDuskSetup, type DuskSetupInput } from '@lumenwright/shared';
import { describe, expect, it, vi } from 'vitest';
import { clockTime } from '../../utils/format';
import { SetupResultView } from './setup-result';

// An evening on a tripod at f/2.8 where a GN 40 m key at 2 m soon needs less than its lowest
// power at the default bias of -1 (shared/tests/bias-floor.test.ts checks those numbers against
// APEX and ISO 1230); with a darkest bias of -2 the planner takes those minutes darker.
const input: DuskSetupInput = {
  latitude: 40.7128,
  longitude: -74.006,
  date: '2026-09-20',
  timeZone: 'America/New_York',
  stepMinutes: 1,
  suggestions: 10,
  camera: { aperture: 2.8, isoMax: 6400, support: 'tripod', biasFloorStops: -2 },
  key: { guideNumber: 40, distance: 2, modifierLossStops: 1 },
};

const rowsOf = () => within(screen.getByRole('table')).getAllByRole('row').slice(1); // no header

describe('Dusk setup result: minutes planned at a darker background', () => {
  it('says the bias used and how much darker on each lowered minute, and only there', () => {
    const plan = planDuskSetup(input);
    render(<SetupResultView plan={plan} input={input} />);
    const rows = rowsOf();
    expect(rows).toHaveLength(plan.suggestedMinutes.length);
    const lowered = plan.suggestedMinutes.filter((m) => m.biasLoweredByStops > 0);
    expect(lowered.length).toBeGreaterThan(0);
    plan.suggestedMinutes.forEach((m, i) => {
      const text = rows[i]!.textContent ?? '';
      if (m.biasLoweredByStops > 0) {
        const bias = Math.abs(m.background.biasStops).toFixed(2);
        expect(text).toContain(
          `background \u2212${bias} stops, ${m.biasLoweredByStops.toFixed(2)} darker`,
        );
      } else {
        expect(text).not.toMatch(/darker/);
      }
    });
  });

  it('shows no note for a plan saved before the darkest bias existed', () => {
    const plan = planDuskSetup(input);
    const old = {
      ...plan,
      suggestedMinutes: plan.suggestedMinutes.map(({ biasLoweredByStops: _gone, ...m }) => m),
    };
    render(<SetupResultView plan={old as never} input={input} />);
    expect(rowsOf().length).toBe(plan.suggestedMinutes.length);
    expect(screen.queryByText(/darker$/)).toBeNull();
  });
});

describe('Dusk setup result: printing', () => {
  it('opens the browser’s print dialog from “Print this plan”, once per click', () => {
    // happy-dom has no print dialog: stand one in (unstubbed after each test by the config).
    const print = vi.fn();
    vi.stubGlobal('print', print);
    render(<SetupResultView plan={planDuskSetup(input)} input={input} />);
    const button = screen.getByRole('button', { name: 'Print this plan' });
    expect(print).not.toHaveBeenCalled();
    fireEvent.click(button);
    expect(print).toHaveBeenCalledTimes(1);
    // Kept off the paper by Tailwind's print variant (print.css also hides every button).
    expect(button.className.split(/\s+/)).toContain('print:hidden');
  });
});

describe('Dusk setup result: usable minutes in runs', () => {
  // The invented evening above, hand-held between sync and a 1/160 s hand-held limit with a GN 20 m
  // key 0.8 m away: its usable minutes fall in two runs (server/test/factories/dusk-evenings.ts;
  // shared/tests/bias-floor.test.ts checks the minute between them with APEX and ISO 1230).
  const gapInput: DuskSetupInput = {
    ...input,
    camera: {
      aperture: 2.8,
      isoMin: 800,
      isoMax: 25600,
      support: 'handheld',
      slowestHandheldSeconds: 1 / 160,
      flashSyncSeconds: 1 / 200,
      biasFloorStops: -6,
    },
    key: { guideNumber: 20, distance: 0.8, modifierLossStops: 1 },
  };
  const usableValue = () =>
    screen.getByText('Usable within it').parentElement?.querySelector('dd')?.textContent ?? '';

  it('lists each run, so a gap inside first–last is not read as usable', () => {
    const plan = planDuskSetup(gapInput);
    const spans = plan.window.usableSpans;
    expect(spans.length).toBeGreaterThan(1);
    render(<SetupResultView plan={plan} input={gapInput} />);
    const text = usableValue();
    expect(text).toContain(' and ');
    // Each run's first minute is shown, in order; the first-to-last range alone is not.
    const firsts = spans.map((s) => clockTime(s.start));
    expect(firsts.every((t) => text.includes(t))).toBe(true);
    expect(text.indexOf(firsts[0]!)).toBeLessThan(text.indexOf(firsts[1]!));
    expect(text).not.toBe(
      `${clockTime(plan.window.usableStart)}–${clockTime(plan.window.usableEnd)}`,
    );
  });

  it('shows first–last for a plan saved before the runs existed', () => {
    const plan = planDuskSetup(gapInput);
    const { usableSpans: _gone, ...window } = plan.window;
    render(<SetupResultView plan={{ ...plan, window } as never} input={gapInput} />);
    expect(usableValue()).toBe(
      `${clockTime(plan.window.usableStart)}–${clockTime(plan.window.usableEnd)}`,
    );
  });
});
