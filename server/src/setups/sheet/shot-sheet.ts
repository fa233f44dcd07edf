// The printable shot sheet: the plan, a top-down diagram, gels and compensation, and the safety
// cautions (those the conditions call for, then the general ones for any dusk shoot).
import {
  cautionAdvice,
  cautionsFor,
  countOf,
  describeUsableSpans,
  type Caution,
  type DuskSetupPlan,
} from '@lumenwright/shared';
import { topDownDiagram } from './diagram.js';
import { clock, esc, fmt } from './escape.js';
import { SHEET_CSS } from './sheet-style.js';

export interface SheetSetup {
  name: string;
  venue: string | null;
  notes: string | null;
  date: string;
  timeZone: string;
  author: string | null;
  plan: DuskSetupPlan;
  resolvedInputs: Record<string, unknown>;
}

type Obj = Record<string, unknown>;
const num = (o: Obj | undefined, k: string): number | undefined =>
  typeof o?.[k] === 'number' ? (o[k] as number) : undefined;

/** Every caution the math library knows, for the "on any dusk shoot" list. */
const ALL_CAUTIONS: Caution[] = cautionsFor({
  nearRoad: true,
  nearWater: true,
  coldFogOrHaze: true,
  modellingLamps: true,
  standsCount: 1,
});

const DEFER_NOTE =
  'These are general reminders, not a safety assessment. Local codes, venue rules, permit conditions, the equipment makers’ instructions and licensed practice (electrical work, rigging, special effects) come first.';

function longDate(date: string): string {
  const d = new Date(`${date}T12:00:00Z`);
  return Number.isNaN(d.getTime())
    ? date
    : new Intl.DateTimeFormat('en-GB', { dateStyle: 'full', timeZone: 'UTC' }).format(d);
}

const row = (label: string, value: string) => `<dt>${esc(label)}</dt><dd>${value}</dd>`;
const range = (a: string | null, b: string | null) => `${clock(a)}–${clock(b)}`;

/** Where the rim's beam lands on the ground; the plan measures from the subject toward the light. */
function spill(b: NonNullable<DuskSetupPlan['backlight']>): string {
  if (!b.groundSpill) return 'none';
  const u = b.distanceUnit;
  const at = (v: number) =>
    v >= 0 ? `${fmt(v, 1)} ${u} toward the light` : `${fmt(-v, 1)} ${u} toward the camera`;
  const { from, to } = b.groundSpill;
  const stops = b.groundVsRimStops === null ? '' : `; ${fmt(b.groundVsRimStops)} stops vs the rim`;
  return `from ${at(from)}${to === null ? ' onward' : ` to ${at(to)}`} of the subject${stops}`;
}

/**
 * The usable minutes as runs, "19:57–20:01 and 20:05–20:07": a gap between runs is a stretch of
 * unusable minutes. A run of one planned minute prints as that minute. Plans saved before the
 * runs were planned carry no `usableSpans`: they print their first and last usable minute.
 */
function usable(w: DuskSetupPlan['window']): string {
  const none = '<span class="no">none — see warnings</span>';
  const spans = (w as Partial<Pick<DuskSetupPlan['window'], 'usableSpans'>>).usableSpans;
  if (!Array.isArray(spans)) return w.usableStart ? range(w.usableStart, w.usableEnd) : none;
  return describeUsableSpans(spans, clock) ?? none;
}

function timing(p: DuskSetupPlan): string {
  const t = p.twilight;
  return `<section><h2>Timing</h2><dl>
    ${row('Sunset', clock(t.sunset))}${row('Golden hour', range(t.goldenHour.start, t.goldenHour.end))}
    ${row('Blue hour', range(t.blueHour.start, t.blueHour.end))}${row('Civil dusk', clock(t.civilDusk))}
    ${row('Nautical dusk', clock(t.nauticalDusk))}${row('Shooting window', range(p.window.start, p.window.end))}
    ${row('Usable (all limits met)', usable(p.window))}
  </dl></section>`;
}

const MINUTE_COLUMNS = [
  'Time',
  'Sun',
  'EV₁₀₀',
  'Camera (background)',
  'Key power',
  'Rim power',
  'Usable',
] as const;

/**
 * A minute planned at a darker background than the setup's bias (camera.biasFloorStops): say so,
 * since its exposure differs from the others'. Plans saved before the floor carry no field.
 */
function darker(m: DuskSetupPlan['suggestedMinutes'][number]): string {
  const lowered = m.biasLoweredByStops ?? 0;
  if (!(lowered > 0)) return '';
  return ` <span class="lowered">(background ${fmt(m.background.biasStops, 2)} stops, ${fmt(lowered, 2)} darker)</span>`;
}

function minutes(p: DuskSetupPlan): string {
  // Out of the light's range either way: name which end, as the plan's warnings do.
  const outOfRange = (f: { feasible: boolean; warnings: Array<{ code: string }> }): string =>
    f.feasible
      ? ''
      : f.warnings.some((w) => w.code === 'below-min-power')
        ? ' <span class="no">(below the lowest power)</span>'
        : ' <span class="no">(over full power)</span>';
  const rows = p.suggestedMinutes
    .map((m) => {
      const cells = [
        clock(m.time),
        `${fmt(m.sunAltitudeDeg)}°`,
        fmt(m.ambientEv100),
        `${esc(m.background.shutterLabel)} · ${esc(m.background.apertureLabel)} · ${esc(m.background.isoLabel)}` +
          darker(m),
        esc(m.keyFlash.powerLabel) + outOfRange(m.keyFlash),
        m.rimFlash ? esc(m.rimFlash.powerLabel) + outOfRange(m.rimFlash) : '—',
        m.usable ? 'yes' : '<span class="no">no</span>',
      ];
      // data-label: on a phone each minute becomes a card of label/value lines (sheet-style.ts).
      return `<tr>${cells.map((c, i) => `<td data-label="${MINUTE_COLUMNS[i]}">${c}</td>`).join('')}</tr>`;
    })
    .join('\n');
  return `<section><h2>Suggested minutes</h2><div class="table-scroll"><table class="minutes">
    <thead><tr>${MINUTE_COLUMNS.map((h) => `<th>${h}</th>`).join('')}</tr></thead>
    <tbody>${rows || '<tr><td colspan="7">No minute in the window.</td></tr>'}</tbody></table></div></section>`;
}

function lights(p: DuskSetupPlan, inputs: Obj): string {
  const key = (inputs.key ?? {}) as Obj;
  const rim = inputs.rim as Obj | undefined;
  const k = p.key;
  const u = k.distanceUnit;
  const keyRows =
    row(
      'Guide number',
      `${fmt(num(key, 'guideNumber'))} ${esc(key.guideNumberUnit ?? 'm')} (ISO 100, full power)`,
    ) +
    row(
      'Distance · angle',
      `${fmt(num(key, 'distance'), 2)} ${u} · ${fmt(num(key, 'angleFromCameraDeg') ?? 60, 0)}° from the camera axis`,
    ) +
    row('Modifier', `${esc(k.modifier)} (${fmt(k.modifierLossStops, 2)} stops loss)`) +
    row(
      'Light',
      `${esc(k.quality)}, ${esc(k.shadowSide)} shadow side, ratio ${esc(k.lightingRatioLabel)}`,
    ) +
    row(
      'Background falloff',
      p.backgroundFalloffStops === null
        ? '—'
        : `${fmt(p.backgroundFalloffStops, 2)} stops darker than the subject`,
    );
  const b = p.backlight;
  const rimRows =
    rim && b
      ? row('Guide number', `${fmt(num(rim, 'guideNumber'))} ${esc(rim.guideNumberUnit ?? 'm')}`) +
        row(
          'Placement',
          `${fmt(num(rim, 'distanceBehind'), 2)} ${b.distanceUnit} behind, ${fmt(num(rim, 'lightHeight'), 2)} ${b.distanceUnit} high, aimed ${fmt(b.aimDeg)}°`,
        ) +
        row(
          'Beam',
          `${fmt(b.beamAngleDeg, 0)}° · head ${b.headInBeam ? 'in' : '<span class="no">outside</span>'} the beam`,
        ) +
        row('Ground spill', spill(b)) +
        row('Gelled', rim.gelled === false ? 'no (renders cooler)' : 'like the key')
      : row('Rim light', 'none');
  return `<div class="grid"><section><h2>Key light</h2><dl>${keyRows}</dl></section>
    <section><h2>Rim light</h2><dl>${rimRows}</dl></section></div>`;
}

function colour(p: DuskSetupPlan): string {
  const g = p.gels;
  const ft = p.whiteBalance.fineTune;
  const gels = g.gels.length
    ? g.gels
        .map(
          (x) =>
            `<tr><td class="gel">${esc(x.name)}</td><td>${fmt(x.miredShift, 0)}</td><td>${fmt(x.lossStops, 2)}</td></tr>`,
        )
        .join('')
    : '<tr><td colspan="3">No gel needed.</td></tr>';
  return `<section><h2>White balance and gels</h2><div class="grid"><dl>
    ${row('Camera white balance', `${fmt(p.whiteBalance.cameraKelvin, 0)} K`)}
    ${row('Flash through the gels', `${fmt(g.resultingFlashKelvin, 0)} K (residual ${fmt(g.residualMired)} mired)`)}
    ${row('Fine-tune to cancel it', `${countOf(Number(fmt(ft.amberBlueSteps, 0)), 'amber/blue step')}${ft.tintCC ? `, tint ${fmt(ft.tintCC)} CC` : ''}`)}
    ${row('Gel loss', `${fmt(g.gelLossStops, 2)} stops`)}
    ${row('Compensation', `raise flash power ${fmt(g.powerCompensationStops, 2)} stops (already in the powers above)`)}
  </dl><table><thead><tr><th>Gel stack</th><th>Mired</th><th>Loss (stops)</th></tr></thead><tbody>${gels}</tbody></table></div></section>`;
}

function cautions(p: DuskSetupPlan): string {
  const shown = new Set(p.cautions.map((c) => c.id));
  // The deference is said once, above the list, not after every caution.
  const item = (c: Caution) =>
    `<li><strong>${esc(c.title)}.</strong> ${esc(cautionAdvice(c))}</li>`;
  const listed = p.cautions.map(item).join('');
  const also = ALL_CAUTIONS.filter((c) => !shown.has(c.id))
    .map(item)
    .join('');
  return `<section class="cautions" id="cautions"><h2>Safety</h2>
    <p>${esc(DEFER_NOTE)}</p><ul>${listed}</ul>
    ${also ? `<h3>Also, if the night brings them</h3><ul class="also">${also}</ul>` : ''}</section>`;
}

function diagram(p: DuskSetupPlan, inputs: Obj): string {
  const key = (inputs.key ?? {}) as Obj;
  const rim = inputs.rim as Obj | undefined;
  const keyDistance = num(key, 'distance') ?? 0;
  const bg = num(inputs, 'backgroundDistance');
  return `<section><h2>Top-down diagram</h2>${topDownDiagram({
    unit: p.key.distanceUnit,
    key: {
      towardCamera: p.key.position.towardCamera,
      sideways: p.key.position.sideways,
      distance: keyDistance,
      angleDeg: num(key, 'angleFromCameraDeg') ?? 60,
      modifier: p.key.modifier,
    },
    rim:
      rim && p.backlight
        ? {
            distanceBehind: num(rim, 'distanceBehind') ?? 0,
            beamAngleDeg: p.backlight.beamAngleDeg,
            height: num(rim, 'lightHeight') ?? 0,
          }
        : null,
    backgroundBehind: bg === undefined ? null : Math.max(0.5, bg - keyDistance),
  })}<p class="print-hint">Camera distance is schematic; the key is drawn on camera-left (mirror it freely).</p></section>`;
}

export function renderShotSheet(s: SheetSetup): string {
  const p = s.plan;
  const warnings = p.warnings.map((w) => `<li>${esc(w.message)}</li>`).join('');
  return `<!doctype html><html lang="en-GB"><head><meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>Shot sheet — ${esc(s.name)}</title><style>${SHEET_CSS}</style></head>
<body><main>
<header><h1>${esc(s.name)}</h1>
<p class="meta">${esc(s.venue ?? 'Venue not set')} · ${esc(longDate(s.date))} · times in ${esc(s.timeZone)}${s.author ? ` · saved by ${esc(s.author)}` : ''}</p>
<p class="print-hint">Print from your browser (Ctrl+P or ⌘P) for a paper copy.</p></header>
${timing(p)}${minutes(p)}${lights(p, s.resolvedInputs)}${colour(p)}${diagram(p, s.resolvedInputs)}
${warnings ? `<section><h2>Check before the shoot</h2><ul>${warnings}</ul></section>` : ''}
${s.notes ? `<section><h2>Notes</h2><p class="notes">${esc(s.notes)}</p></section>` : ''}
${cautions(p)}
<footer>Ambient light is modelled (±${countOf(Number(fmt(p.twilight.ambientUncertaintyStops)), 'stop')} or more): meter on the night and adjust. Lumenwright shot sheet.</footer>
</main></body></html>`;
}
