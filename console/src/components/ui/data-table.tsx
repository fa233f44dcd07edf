import { tableFeatures, useTable, type ColumnDef, type RowData } from '@tanstack/react-table';
import { useScrollsSideways } from './side-scroll';

const features = tableFeatures({});

export type DataColumn<Row extends RowData> = ColumnDef<typeof features, Row, unknown>;

interface DataTableProps<Row extends RowData> {
  /** Names the table for screen readers (rendered as its caption). */
  caption: string;
  columns: DataColumn<Row>[];
  data: Row[];
  getRowId?: (row: Row) => string;
  empty?: React.ReactNode;
  /** Pager or other controls under the table. */
  footer?: React.ReactNode;
  /**
   * Where the columns do not fit: `cards` (rows become cards whenever the table's box is under
   * 48rem, so actions in the last column stay in view) or `scroll` (a long read-only list: the
   * table scrolls sideways in its box, and turns into cards only on a phone).
   */
  narrow?: 'cards' | 'scroll';
}

/**
 * The one table of the console: TanStack Table for the model, our own semantic markup. Where the
 * columns do not fit (a phone; with `narrow="cards"` any box under 48rem, e.g. beside the rail on a
 * tablet) each row becomes a card of "label  value" lines (labels from the column headers), so
 * actions in the last column are in view without scrolling sideways.
 */
export function DataTable<Row extends RowData>({
  caption,
  columns,
  data,
  getRowId,
  empty = 'Nothing here yet.',
  footer,
  narrow = 'cards',
}: DataTableProps<Row>) {
  const table = useTable({
    features,
    columns,
    data,
    getRowId: getRowId ? (row: Row) => getRowId(row) : undefined,
  });
  const rows = table.getRowModel().rows;
  const [scrollBox, scrolls] = useScrollsSideways<HTMLDivElement>();
  return (
    // The container the `cards:` variant measures (styles/index.css).
    <div className={narrow === 'cards' ? '@container/table-cards' : ''}>
      {/* relative: keeps sr-only cells (absolutely positioned) inside the scroll box on phones */}
      <div
        ref={scrollBox}
        className="relative overflow-x-auto rounded-card border border-edge"
        // Where the table scrolls sideways, the keyboard must be able to scroll it too.
        {...(scrolls ? { tabIndex: 0, role: 'region', 'aria-label': caption } : {})}
      >
        <table className="w-full border-collapse text-left text-small cards:block">
          <caption className="sr-only">{caption}</caption>
          <thead className="bg-raised cards:sr-only">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => (
                  <th
                    key={header.id}
                    scope="col"
                    className="border-b border-edge px-3 py-2 font-semibold whitespace-nowrap text-ink"
                  >
                    {header.isPlaceholder ? null : <table.FlexRender header={header} />}
                  </th>
                ))}
              </tr>
            ))}
          </thead>
          <tbody className="cards:block">
            {rows.length === 0 ? (
              <tr className="cards:block">
                <td colSpan={columns.length} className="px-3 py-4 text-ink-muted cards:block">
                  {empty}
                </td>
              </tr>
            ) : (
              rows.map((row) => (
                <tr
                  key={row.id}
                  className="border-b border-edge last:border-b-0 cards:block cards:py-2"
                >
                  {row.getAllCells().map((cell) => (
                    <td
                      key={cell.id}
                      data-label={headerText(cell.column.columnDef.header)}
                      className="px-3 py-2 align-top text-ink tabular-nums cards:flex cards:justify-between cards:gap-4 cards:py-1 cards:text-right cards:before:text-left cards:before:font-semibold cards:before:content-[attr(data-label)]"
                    >
                      <table.FlexRender cell={cell} />
                    </td>
                  ))}
                </tr>
              ))
            )}
          </tbody>
        </table>
      </div>
      {footer}
    </div>
  );
}

/** A column's header as plain text for the phone layout's labels ('' for rendered headers). */
function headerText(header: unknown): string {
  return typeof header === 'string' ? header : '';
}
