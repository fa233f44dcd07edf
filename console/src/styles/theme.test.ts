import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { contrastRatio, readBlock, relativeLuminance, resolveToken } from './contrast';

describe('WCAG 2.2 contrast arithmetic', () => {
  // W3C WCAG 2.2: black on white is the maximum ratio, 21:1.
  it('gives 21:1 for black on white and 1:1 for a colour on itself', () => {
    expect(contrastRatio('#000000', '#ffffff')).toBeCloseTo(21, 6);
    expect(contrastRatio('#8f7a6b', '#8f7a6b')).toBeCloseTo(1, 6);
  });
  // Derived from the WCAG 2.2 definitions: #767676 is L = 0.1812, 4.54:1 on white, the lightest
  // grey that passes AA for body text on white (also the figure WebAIM's contrast guidance quotes).
  it('gives 4.54:1 for #767676 on white, and 4.48:1 for #777777', () => {
    expect(relativeLuminance('#767676')).toBeCloseTo(0.1812, 3);
    expect(contrastRatio('#767676', '#ffffff')).toBeCloseTo(4.54, 2);
    expect(contrastRatio('#777777', '#ffffff')).toBeCloseTo(4.48, 2);
  });
});

// Read the stylesheet itself (Vitest does not load CSS into modules).
const css = readFileSync(join(import.meta.dirname, 'theme.css'), 'utf8');
const dayTokens = readBlock(css, '@theme static');
const nightTokens = readBlock(css, "[data-theme='night']");
const themes = {
  day: (token: string) => resolveToken(token, dayTokens),
  night: (token: string) => resolveToken(token, nightTokens, dayTokens),
};

const surfaces = ['--color-canvas', '--color-panel', '--color-raised'];
const textTokens = [
  '--color-ink',
  '--color-ink-muted',
  '--color-accent',
  '--color-link',
  '--color-ok',
  '--color-fault',
  '--color-caution',
];

describe.each(Object.entries(themes))('%s theme meets WCAG 2.2 AA', (_name, color) => {
  it.each(textTokens.flatMap((text) => surfaces.map((surface) => [text, surface])))(
    'text %s on %s is at least 4.5:1 (SC 1.4.3)',
    (text, surface) => {
      expect(contrastRatio(color(text), color(surface))).toBeGreaterThanOrEqual(4.5);
    },
  );
  it('text on the accent fill is at least 4.5:1', () => {
    expect(
      contrastRatio(color('--color-on-accent'), color('--color-accent')),
    ).toBeGreaterThanOrEqual(4.5);
  });
  // Chart labels sit on the shaded twilight bands; series lines are graphics (SC 1.4.11).
  it.each([
    ['--color-ink', '--color-chart-golden'],
    ['--color-ink', '--color-chart-blue'],
    ['--color-ink-muted', '--color-chart-civil'],
    ['--color-ink-muted', '--color-chart-nautical'],
    ['--color-ink-muted', '--color-chart-astro'],
  ])('chart label %s on band %s is at least 4.5:1', (text, band) => {
    expect(contrastRatio(color(text), color(band))).toBeGreaterThanOrEqual(4.5);
  });
  it.each(['--color-chart-sun', '--color-chart-ev'])(
    'series %s on the panel is at least 3:1',
    (series) => {
      expect(contrastRatio(color(series), color('--color-panel'))).toBeGreaterThanOrEqual(3);
    },
  );
  it.each(surfaces)(
    'control edges and focus rings on %s are at least 3:1 (SC 1.4.11)',
    (surface) => {
      expect(contrastRatio(color('--color-edge-strong'), color(surface))).toBeGreaterThanOrEqual(3);
      expect(contrastRatio(color('--color-focus'), color(surface))).toBeGreaterThanOrEqual(3);
    },
  );
});

describe('night theme protects dark adaptation', () => {
  // Common practice, no source: keep night screens dim and red-leaning (no bright or blue light).
  it('keeps every surface and text token dimmer than the day ink on day canvas would be', () => {
    for (const token of [...surfaces, ...textTokens, '--color-link', '--color-focus']) {
      expect(relativeLuminance(themes.night(token))).toBeLessThan(0.4);
    }
    for (const token of surfaces) expect(relativeLuminance(themes.night(token))).toBeLessThan(0.01);
  });
  it('keeps text red-leaning: red channel above blue for ink, muted ink and links', () => {
    for (const token of ['--color-ink', '--color-ink-muted', '--color-link', '--color-accent']) {
      const n = parseInt(themes.night(token).slice(1), 16);
      expect(n >> 16).toBeGreaterThan(n & 255);
    }
  });
});
