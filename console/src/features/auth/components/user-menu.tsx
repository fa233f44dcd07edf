import { Menu, MenuButton, MenuItem, MenuItems } from '@headlessui/react';
import { Link, useNavigate } from 'react-router-dom';
import { paths, settingsNav } from '@/config/paths';
import { useSession } from '@/lib/session';
import { useSignOut } from '../api/sign-out';

/** The signed-in member, their studio and role, links to their settings, and sign-out. */
export function UserMenu() {
  const session = useSession();
  const signOut = useSignOut();
  const navigate = useNavigate();
  if (!session) return null;

  const onSignOut = () => {
    signOut.mutate(undefined, {
      onSettled: () => void navigate(paths.signIn, { replace: true }),
    });
  };

  return (
    <Menu as="div" className="relative">
      <MenuButton className="flex w-full flex-col items-start rounded-control border border-edge-strong px-3 py-2 text-left data-focus:outline-2 data-focus:outline-focus">
        <span className="text-small font-medium text-ink">{session.user.name}</span>
        <span className="text-caption text-ink-muted">
          {session.organization.name} · {session.role}
        </span>
      </MenuButton>
      <MenuItems
        anchor="top start"
        className="z-40 w-56 rounded-control border border-edge-strong bg-panel p-1 shadow-lg focus:outline-none"
      >
        <div className="px-3 py-2 text-caption break-all text-ink-muted">{session.user.email}</div>
        {settingsNav
          .filter((entry) => !entry.permission || session.permissions.includes(entry.permission))
          .map((entry) => (
            <MenuItem key={entry.to}>
              <Link
                to={entry.to}
                title={entry.hint}
                className="block rounded-control px-3 py-2 text-small text-ink no-underline data-focus:bg-raised"
              >
                {entry.label}
              </Link>
            </MenuItem>
          ))}
        <MenuItem>
          <button
            type="button"
            onClick={onSignOut}
            className="block w-full rounded-control px-3 py-2 text-left text-small text-ink data-focus:bg-raised"
          >
            Sign out
          </button>
        </MenuItem>
      </MenuItems>
    </Menu>
  );
}
