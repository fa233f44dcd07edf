import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';

/** Wordmark: a horizon line with the last of the sun and one small light above it. */
export function Brand() {
  return (
    <Link
      to={paths.overview}
      className="flex items-center gap-2 text-lead font-semibold text-ink no-underline"
    >
      <svg aria-hidden="true" viewBox="0 0 32 32" className="size-7">
        <path d="M4 22h24" stroke="var(--color-ink-muted)" strokeWidth="2" strokeLinecap="round" />
        <path d="M9 22a7 7 0 0 1 14 0" fill="var(--color-accent)" />
        <circle cx="23" cy="9" r="2.5" fill="var(--color-ink)" />
      </svg>
      <span>Lumenwright</span>
    </Link>
  );
}
