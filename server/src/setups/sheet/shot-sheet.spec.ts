// The shot sheet says which end of a light's range a minute falls off: a key too weak for the
// distance is "over full power", one too strong for the closest setting is "below the lowest power".
import {
  CAUTION_DEFERENCE,
  cautionAdvice,
  clockOf,
  planDuskSetup,
  type DuskSetupInput,
  type DuskSetupPlan,
} from '@lumenwright/shared';
import { EVENING_40N as EVENING, GAP_EVENING } from '../../../test/factories/dusk-evenings.js';
import { esc } from './escape.js';
import { renderShotSheet } from './shot-sheet.js';

const BASE: DuskSetupInput = {
  latitude: 54.21,
  longitude: -2.47,
  date: '2026-09-12',
  timeZone: 'Europe/London',
  camera: { aperture: 4, isoMax: 6400, support: 'tripod' },
  key: { guideNumber: 40, distance: 3, modifier: 'softbox' },
};

/** The sheet printed for a plan (possibly one saved earlier, with fields missing). */
function sheetOf(plan: unknown, input: DuskSetupInput) {
  return renderShotSheet({
    name: 'Sheet check',
    venue: null,
    notes: null,
    date: input.date,
    timeZone: input.timeZone,
    author: null,
    plan: plan as DuskSetupPlan,
    resolvedInputs: input as unknown as Record<string, unknown>,
  });
}

/** The plan for `input` and its printed sheet. */
function render(input: DuskSetupInput) {
  const plan = planDuskSetup(input);
  return { plan, html: sheetOf(plan, input) };
}

function sheetFor(key: DuskSetupInput['key']) {
  const { plan, html } = render({ ...BASE, key });
  const table = /<table class="minutes">[\s\S]*?<\/table>/.exec(html)?.[0] ?? '';
  return { plan, table };
}

describe('shot sheet power column', () => {
  it('marks a key that needs more than full power as over full power', () => {
    // GN 8 m at 12 m through a softbox at f/4: (4 × 12 / 8)² = 36× full power before losses,
    // so every minute is out of range at the top (GN = f-number × distance, ISO 100).
    const { plan, table } = sheetFor({ guideNumber: 8, distance: 12, modifier: 'softbox' });
    expect(plan.suggestedMinutes.length).toBeGreaterThan(0);
    expect(plan.suggestedMinutes.every((m) => !m.keyFlash.feasible)).toBe(true);
    expect(table).toContain('(over full power)');
    expect(table).not.toContain('(below the lowest power)');
  });

  it('marks a key that is too strong even at its lowest setting as below the lowest power', () => {
    // GN 300 m at 0.3 m bare at f/4: (4 × 0.3 / 300)² ≈ 1.6e-5 of full power, far under 1/256.
    const { plan, table } = sheetFor({ guideNumber: 300, distance: 0.3, modifier: 'bare' });
    expect(plan.suggestedMinutes.length).toBeGreaterThan(0);
    expect(
      plan.suggestedMinutes.every((m) =>
        m.keyFlash.warnings.some((w) => w.code === 'below-min-power'),
      ),
    ).toBe(true);
    expect(table).toContain('(below the lowest power)');
    expect(table).not.toContain('(over full power)');
  });

  it('adds no range note when the key is within range', () => {
    const { plan, table } = sheetFor(BASE.key);
    const inRange = plan.suggestedMinutes.filter((m) => m.keyFlash.feasible);
    expect(inRange.length).toBeGreaterThan(0);
    const rows = table.split('<tr>').filter((r) => r.includes('data-label="Key power"'));
    expect(rows.length).toBe(plan.suggestedMinutes.length);
    rows.forEach((row, i) => {
      const marked = row.includes('power)</span>');
      expect(marked).toBe(!plan.suggestedMinutes[i]!.keyFlash.feasible);
    });
  });
});

describe('shot sheet minutes planned at a darker background', () => {
  // An evening on a tripod at f/2.8 where a GN 40 m key at 2 m soon needs less than its lowest
  // power at the default bias of -1 (see shared/tests/bias-floor.test.ts): with a floor the
  // planner takes those minutes darker, and the sheet says by how much.
  const input: DuskSetupInput = {
    ...EVENING,
    camera: { aperture: 2.8, isoMax: 6400, support: 'tripod', biasFloorStops: -2 },
    key: { guideNumber: 40, distance: 2, modifierLossStops: 1 },
  };

  it('marks each lowered minute with the bias it used, and only those', () => {
    const { plan, html } = render(input);
    const table = /<table class="minutes">[\s\S]*?<\/table>/.exec(html)?.[0] ?? '';
    const rows = table.split('<tr>').filter((r) => r.includes('data-label="Camera (background)"'));
    expect(rows.length).toBe(plan.suggestedMinutes.length);
    const lowered = plan.suggestedMinutes.filter((m) => m.biasLoweredByStops > 0);
    expect(lowered.length).toBeGreaterThan(0);
    rows.forEach((row, i) => {
      const m = plan.suggestedMinutes[i]!;
      if (m.biasLoweredByStops > 0) {
        expect(row).toContain(
          `(background ${m.background.biasStops} stops, ${m.biasLoweredByStops} darker)`,
        );
      } else {
        expect(row).not.toContain('class="lowered"');
      }
    });
  });

  it('shows no note for a plan saved before the floor existed (no field on its minutes)', () => {
    const { plan } = render(input);
    const old = {
      ...plan,
      suggestedMinutes: plan.suggestedMinutes.map(({ biasLoweredByStops: _gone, ...m }) => m),
    };
    const html = sheetOf(old, input);
    expect(html).not.toContain('class="lowered"');
    expect(html).toContain('<table class="minutes">');
  });
});

describe('shot sheet usable runs (Timing)', () => {
  // Two runs with a gap (test/factories/usable-gap.ts).
  const gap: DuskSetupInput = GAP_EVENING;
  const usableRow = (html: string) =>
    /<dt>Usable \(all limits met\)<\/dt><dd>([\s\S]*?)<\/dd>/.exec(html)?.[1];
  const at = (hhmm: string) => `2026-09-20T${hhmm}:00-04:00`;
  const withWindow = (plan: DuskSetupPlan, window: Record<string, unknown>) => ({
    ...plan,
    window: { ...plan.window, ...window },
  });

  it('prints each run, a single minute as that minute, joined by "and"', () => {
    const { plan, html } = render(gap);
    const spans = plan.window.usableSpans;
    expect(spans).toHaveLength(2);
    // The first run is one planned minute, the second several (the plan's own clock times).
    expect(spans[0]!.start).toBe(spans[0]!.end);
    expect(spans[1]!.lengthMinutes).toBeGreaterThan(0);
    expect(usableRow(html)).toBe(
      `${clockOf(spans[0]!.start)} and ${clockOf(spans[1]!.start)}–${clockOf(spans[1]!.end)}`,
    );
  });

  it('lists three runs as "a, b and c", and "none" for an empty list', () => {
    const { plan } = render(gap);
    const three = withWindow(plan, {
      usableSpans: [
        { start: at('19:57'), end: at('20:01'), lengthMinutes: 4 },
        { start: at('20:03'), end: at('20:03'), lengthMinutes: 0 },
        { start: at('20:05'), end: at('20:07'), lengthMinutes: 2 },
      ],
    });
    expect(usableRow(sheetOf(three, gap))).toBe('19:57–20:01, 20:03 and 20:05–20:07');
    const empty = withWindow(plan, { usableStart: null, usableEnd: null, usableSpans: [] });
    expect(usableRow(sheetOf(empty, gap))).toContain('none — see warnings');
  });

  it('prints first–last usable minute for a plan saved before the runs (no usableSpans)', () => {
    const { plan } = render(gap);
    const { usableSpans: _gone, ...oldWindow } = plan.window;
    const old = { ...plan, window: oldWindow };
    expect(usableRow(sheetOf(old, gap))).toBe(
      `${clockOf(plan.window.usableStart!)}–${clockOf(plan.window.usableEnd!)}`,
    );
    const oldNone = { ...plan, window: { ...oldWindow, usableStart: null, usableEnd: null } };
    expect(usableRow(sheetOf(oldNone, gap))).toContain('none — see warnings');
  });
});

describe('shot sheet cautions', () => {
  it('says the deference to local rules once, not after every caution', () => {
    const { plan, html } = render({ ...BASE, conditions: { nearRoad: true, nearWater: true } });
    const section = /<section class="cautions"[\s\S]*?<\/section>/.exec(html)?.[0] ?? '';
    expect(section.split(esc(CAUTION_DEFERENCE)).length - 1).toBe(0);
    expect(section).toMatch(/Local codes, venue rules/);
    for (const c of plan.cautions) expect(section).toContain(esc(cautionAdvice(c)));
    // Every caution in the API answer still carries it, so each stands alone.
    for (const c of plan.cautions) expect(c.text.endsWith(CAUTION_DEFERENCE)).toBe(true);
  });
});
