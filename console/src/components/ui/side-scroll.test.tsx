import { render } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ChartFigure } from './side-scroll';
import { DataTable } from './data-table';

// happy-dom lays nothing out: the box's inner and outer widths are set here as a browser would
// measure them (a 512 px chart in a 358 px frame on a 390 px phone, or a frame wide enough).
function widths(scrollWidth: number, clientWidth: number) {
  vi.spyOn(HTMLElement.prototype, 'scrollWidth', 'get').mockReturnValue(scrollWidth);
  vi.spyOn(HTMLElement.prototype, 'clientWidth', 'get').mockReturnValue(clientWidth);
}

afterEach(() => {
  vi.restoreAllMocks();
});

describe('boxes that scroll sideways', () => {
  it('makes a chart frame a Tab stop only while its drawing is wider than the frame', () => {
    widths(512, 358);
    const wide = render(<ChartFigure>chart</ChartFigure>);
    expect(wide.container.querySelector('figure')!.getAttribute('tabindex')).toBe('0');
    wide.unmount();

    widths(900, 900);
    const fits = render(<ChartFigure>chart</ChartFigure>);
    expect(fits.container.querySelector('figure')!.hasAttribute('tabindex')).toBe(false);
  });

  it('names a table’s scroll box after its caption when it scrolls, and leaves it alone when not', () => {
    const table = (
      <DataTable
        caption="Invoices"
        columns={[{ id: 'n', header: 'Number', accessorFn: (row: { n: string }) => row.n }]}
        data={[{ n: 'A-1' }]}
        narrow="scroll"
      />
    );
    widths(700, 400);
    const wide = render(table);
    const region = wide.getByRole('region', { name: 'Invoices' });
    expect(region.getAttribute('tabindex')).toBe('0');
    wide.unmount();

    widths(400, 400);
    const fits = render(table);
    expect(fits.queryByRole('region')).toBeNull();
    expect(fits.getByRole('table').parentElement!.hasAttribute('tabindex')).toBe(false);
  });
});
