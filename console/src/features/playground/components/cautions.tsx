import { CAUTION_DEFERENCE, cautionAdvice, type Caution } from '@lumenwright/shared';

interface CautionsProps {
  /** From shared's `cautionsFor` (or a setup plan's `cautions`), so API and console agree. */
  cautions: readonly Caution[];
  className?: string;
}

/** Safety reminders for the situations a result puts people in. General, not an assessment. */
export function Cautions({ cautions, className = '' }: CautionsProps) {
  if (cautions.length === 0) return null;
  return (
    <aside
      aria-label="Safety cautions"
      className={`rounded-card border border-caution/60 bg-panel p-4 ${className}`}
    >
      <h3 className="flex items-center gap-2 text-body font-semibold text-caution">
        <svg aria-hidden="true" viewBox="0 0 20 20" className="size-5 fill-current">
          <path d="M10 2 1 18h18L10 2Zm-.9 5h1.8v5H9.1V7Zm0 6.5h1.8v1.8H9.1v-1.8Z" />
        </svg>
        Before you set up
      </h3>
      <ul className="mt-2 space-y-2 text-small">
        {cautions.map((caution) => (
          <li key={caution.id} data-caution={caution.id}>
            <strong className="font-semibold text-ink">{caution.title}.</strong>{' '}
            <span className="text-ink-muted">{cautionAdvice(caution)}</span>
          </li>
        ))}
      </ul>
      <p className="mt-3 text-caption text-ink-muted">
        General reminders, not a safety assessment. {CAUTION_DEFERENCE} Electrical work, rigging and
        special effects are for licensed practice.
      </p>
    </aside>
  );
}
