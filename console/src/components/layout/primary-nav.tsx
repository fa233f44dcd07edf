import { NavLink } from 'react-router-dom';
import { primaryNav } from '@/config/paths';
import { useSession } from '@/lib/session';

interface PrimaryNavProps {
  id?: string;
  className?: string;
  onNavigate?: () => void;
}

/** The main sections; plain links so they open in new tabs and work without script state. */
export function PrimaryNav({ id, className, onNavigate }: PrimaryNavProps) {
  const session = useSession();
  // Hide what the role can't do (the server refuses it anyway); with no session show everything.
  const entries = primaryNav.filter(
    (entry) => !session || !entry.permission || session.permissions.includes(entry.permission),
  );
  return (
    <nav id={id} aria-label="Primary" className={className}>
      <ul className="flex flex-col gap-1">
        {entries.map((entry) => (
          <li key={entry.to}>
            <NavLink
              to={entry.to}
              end={entry.to === '/'}
              title={entry.hint}
              onClick={onNavigate}
              className={({ isActive }) =>
                [
                  'block rounded-control px-3 py-2 text-body font-medium no-underline transition-colors',
                  isActive
                    ? 'bg-raised text-ink shadow-[inset_3px_0_0_var(--color-accent)]'
                    : 'text-ink-muted hover:bg-raised hover:text-ink',
                ].join(' ')
              }
            >
              {entry.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
