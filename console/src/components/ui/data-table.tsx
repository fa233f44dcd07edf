import { tableFeatures, useTable, type ColumnDef, type RowData } from '@tanstack/react-table';

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
}

/**
 * The one table of the console: TanStack Table for the model, our own semantic markup. On a phone
 * each row becomes a card of "label  value" lines (labels from the column headers), so actions in
 * the last column are in view without scrolling sideways.
 */
export function DataTable<Row extends RowData>({
  caption,
  columns,
  data,
  getRowId,
  empty = 'Nothing here yet.',
  footer,
}: DataTableProps<Row>) {
  const table = useTable({
    features,
    columns,
    data,
    getRowId: getRowId ? (row: Row) => getRowId(row) : undefined,
  });
  const rows = table.getRowModel().rows;
  return (
    <div>
      {/* relative: keeps sr-only cells (absolutely positioned) inside the scroll box on phones */}
      <div className="relative overflow-x-auto rounded-card border border-edge">
        <table className="w-full border-collapse text-left text-small max-sm:block">
          <caption className="sr-only">{caption}</caption>
          <thead className="bg-raised max-sm:sr-only">
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
          <tbody className="max-sm:block">
            {rows.length === 0 ? (
              <tr className="max-sm:block">
                <td colSpan={columns.length} className="px-3 py-4 text-ink-muted max-sm:block">
                  {empty}
                </td>
              </tr>
            ) : (
              rows.map((row) => (
                <tr
                  key={row.id}
                  className="border-b border-edge last:border-b-0 max-sm:block max-sm:py-2"
                >
                  {row.getAllCells().map((cell) => (
                    <td
                      key={cell.id}
                      data-label={headerText(cell.column.columnDef.header)}
                      className="px-3 py-2 align-top text-ink tabular-nums max-sm:flex max-sm:justify-between max-sm:gap-4 max-sm:py-1 max-sm:text-right max-sm:before:text-left max-sm:before:font-semibold max-sm:before:content-[attr(data-label)]"
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
