/**
 * WCAG 2.2 contrast, used to check the palette (src/styles/theme.test.ts).
 * Definitions: W3C, Web Content Accessibility Guidelines 2.2, "relative luminance" and
 * "contrast ratio" (sRGB channel linearisation with the 0.04045 threshold, as WCAG 2.2 notes).
 */
export function relativeLuminance(hex: string): number {
  const match = /^#([0-9a-f]{6})$/i.exec(hex.trim());
  if (!match) throw new Error(`Expected a #rrggbb colour, got ${hex}`);
  const n = parseInt(match[1]!, 16);
  const channel = (value: number) => {
    const c = value / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  };
  return 0.2126 * channel(n >> 16) + 0.7152 * channel((n >> 8) & 255) + 0.0722 * channel(n & 255);
}

export function contrastRatio(a: string, b: string): number {
  const la = relativeLuminance(a);
  const lb = relativeLuminance(b);
  return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
}

/** Custom properties declared directly inside the first block that opens with `selector {`. */
export function readBlock(css: string, selector: string): Map<string, string> {
  const start = css.indexOf(`${selector} {`);
  if (start < 0) throw new Error(`No block for ${selector}`);
  const end = css.indexOf('\n}', start);
  const body = css.slice(start, end).replace(/\/\*[\s\S]*?\*\//g, '');
  const vars = new Map<string, string>();
  for (const m of body.matchAll(/(--[\w-]+)\s*:\s*([^;]+);/g)) vars.set(m[1]!, m[2]!.trim());
  return vars;
}

/** Follow var(--x) references until a literal colour. */
export function resolveToken(name: string, ...scopes: Map<string, string>[]): string {
  for (let depth = 0; depth < 10; depth++) {
    const value = scopes.map((scope) => scope.get(name)).find((v) => v !== undefined);
    if (value === undefined) throw new Error(`Token ${name} is not defined`);
    const ref = /^var\((--[\w-]+)\)$/.exec(value);
    if (!ref) return value;
    name = ref[1]!;
  }
  throw new Error(`Token ${name} refers too deep`);
}
