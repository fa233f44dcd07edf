/** The left-hand column of a calculation: its inputs, in a labelled group. */
export function FormGrid({ legend, children }: { legend: string; children: React.ReactNode }) {
  return (
    <fieldset className="grid grid-cols-2 gap-3 rounded-card border border-edge bg-panel p-4">
      <legend className="px-1 text-small font-semibold text-ink">{legend}</legend>
      {children}
    </fieldset>
  );
}

/** Readouts as a definition list. */
export function Readouts({
  items,
}: {
  items: { term: string; value: React.ReactNode; hint?: string }[];
}) {
  return (
    <dl className="grid grid-cols-2 gap-x-4 gap-y-3 sm:grid-cols-3">
      {items.map((item) => (
        <div key={item.term} className="min-w-0">
          <dt className="text-caption text-ink-muted">{item.term}</dt>
          <dd className="text-lead font-semibold text-ink tabular-nums">{item.value}</dd>
          {item.hint ? <dd className="text-caption text-ink-muted">{item.hint}</dd> : null}
        </div>
      ))}
    </dl>
  );
}
