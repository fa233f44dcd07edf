/** A calculation's warnings, one bordered line each; nothing when there are none. */
export function WarningList({
  warnings,
}: {
  warnings: ReadonlyArray<{ code: string; message: string }>;
}) {
  if (warnings.length === 0) return null;
  return (
    <ul className="flex flex-col gap-2" aria-label="Warnings">
      {warnings.map((warning) => (
        <li
          key={warning.code}
          className="rounded-control border border-caution/50 bg-panel px-3 py-2 text-small text-ink"
        >
          {warning.message}
        </li>
      ))}
    </ul>
  );
}
