import { render } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { TopDiagram } from './top-diagram';

const keyAt = (sideways: number) => ({
  sideways,
  towardCamera: 2,
  size: 0.9,
  angleFromCameraDeg: 60,
  label: 'Softbox, double diffusion',
});

const labelOf = (container: HTMLElement) => {
  const svg = container.querySelector('svg[data-diagram="top"]')!;
  const width = Number(svg.getAttribute('viewBox')!.split(' ')[2]);
  const text = svg.querySelector('[data-key-label]')!;
  return { width, x: Number(text.getAttribute('x')), anchor: text.getAttribute('text-anchor') };
};

describe('plan view key label', () => {
  // A long modifier name next to a key near the edge ran off the drawing: the label now runs
  // from the key toward the middle and starts inside the drawing.
  it('runs leftward from a key on the right, ending inside the drawing', () => {
    const { container } = render(<TopDiagram unit="m" keyLight={keyAt(3.5)} />);
    const label = labelOf(container);
    expect(label.anchor).toBe('end');
    expect(label.x).toBeLessThanOrEqual(label.width - 4);
    expect(label.x).toBeGreaterThan(label.width / 2);
  });

  it('runs rightward from a key on the left, starting inside the drawing', () => {
    const { container } = render(<TopDiagram unit="m" keyLight={keyAt(-3.5)} />);
    const label = labelOf(container);
    expect(label.anchor).toBe('start');
    expect(label.x).toBeGreaterThanOrEqual(4);
    expect(label.x).toBeLessThan(label.width / 2);
  });
});
