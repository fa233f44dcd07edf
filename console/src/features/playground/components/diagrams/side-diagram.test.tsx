import { render } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { SideDiagram, type SideRim } from './side-diagram';

const rim = (over: Partial<SideRim>): SideRim => ({
  distanceBehind: 2.5,
  lightHeight: 1.2,
  aimDeg: 9.1,
  beamAngleDeg: 30,
  groundSpill: null,
  ...over,
});

const drawn = (container: HTMLElement) => {
  const svg = container.querySelector('svg[data-diagram="side"]')!;
  const width = Number(svg.getAttribute('viewBox')!.split(' ')[2]);
  const text = (selector: string) => {
    const el = svg.querySelector(selector)!;
    return {
      x: Number(el.getAttribute('x')),
      anchor: el.getAttribute('text-anchor') ?? 'start',
      mark: el,
    };
  };
  return { width, svg, text };
};

describe('side view labels', () => {
  // A spill that runs off the drawing toward the camera is marked at the left edge; its label,
  // centred on that mark, was cut in half. It now starts at the mark.
  it('starts the ground spill label at a spill marked at the left edge', () => {
    const { container } = render(
      <SideDiagram
        unit="m"
        headHeight={1.6}
        rim={rim({ groundSpill: { from: -9.1, to: null } })}
      />,
    );
    const { text, svg } = drawn(container);
    const mark = Number(svg.querySelector('[data-spill] rect')!.getAttribute('x'));
    const label = text('[data-spill] text');
    expect(label.anchor).toBe('start');
    expect(label.x).toBe(mark);
    expect(label.x).toBeGreaterThanOrEqual(14);
  });

  it('centres the ground spill label under a spill in the middle of the drawing', () => {
    const { container } = render(
      <SideDiagram
        unit="m"
        headHeight={1.6}
        rim={rim({ lightHeight: 2.5, aimDeg: -20, groundSpill: { from: 0.4, to: 1.8 } })}
      />,
    );
    const { text, svg, width } = drawn(container);
    const rect = svg.querySelector('[data-spill] rect')!;
    const centre = Number(rect.getAttribute('x')) + Number(rect.getAttribute('width')) / 2;
    const label = text('[data-spill] text');
    expect(label.anchor).toBe('middle');
    expect(label.x).toBeCloseTo(centre, 6);
    expect(label.x).toBeGreaterThan(width / 4);
    expect(label.x).toBeLessThan((3 * width) / 4);
  });

  const heightLabel = (container: HTMLElement) => {
    const svg = container.querySelector('svg[data-diagram="side"]')!;
    const label = [...svg.querySelectorAll('[data-light="rim"] text')].find((t) =>
      t.textContent?.endsWith('high'),
    )!;
    return {
      width: Number(svg.getAttribute('viewBox')!.split(' ')[2]),
      stand: Number(svg.querySelector('[data-light="rim"] circle')!.getAttribute('cx')),
      x: Number(label.getAttribute('x')),
      anchor: label.getAttribute('text-anchor') ?? 'start',
    };
  };

  it('puts the rim’s height label right of its stand when there is room', () => {
    const { container } = render(<SideDiagram unit="m" headHeight={1.6} rim={rim({})} />);
    const label = heightLabel(container);
    expect(label.anchor).toBe('start');
    expect(label.x).toBeGreaterThan(label.stand);
  });

  it('puts the rim’s height label left of its stand when the stand is near the right edge', () => {
    // A light far behind: the drawing is scaled to its width and the stand ends up near the edge.
    const { container } = render(
      <SideDiagram unit="m" headHeight={1.6} rim={rim({ distanceBehind: 12 })} />,
    );
    const label = heightLabel(container);
    expect(label.width - label.stand).toBeLessThan(70);
    expect(label.anchor).toBe('end');
    expect(label.x).toBeLessThan(label.stand);
  });
});
