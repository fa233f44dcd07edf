import { Suspense, useId, useState } from 'react';
import { Outlet, useLocation } from 'react-router-dom';
import { PageLoading } from '@/components/ui/page-loading';
import { Brand } from './brand';
import { PrimaryNav } from './primary-nav';
import { ThemeToggle } from './theme-toggle';

interface AppShellProps {
  /** The API status badge, passed in by the app so layout stays free of features. */
  status?: React.ReactNode;
  /** The signed-in member's menu (sign-out), passed in by the app for the same reason. */
  userMenu?: React.ReactNode;
}

export function AppShell({ status, userMenu }: AppShellProps) {
  // The phone menu belongs to the page it was opened on: any navigation (the nav, or the user
  // menu's Account link) closes it.
  const { pathname } = useLocation();
  const [openOn, setOpenOn] = useState<string | null>(null);
  const menuOpen = openOn === pathname;
  const setMenuOpen = (open: boolean) => setOpenOn(open ? pathname : null);
  const navId = useId();

  return (
    <div className="min-h-dvh md:grid md:grid-cols-[var(--spacing-rail)_1fr] print:block">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:fixed focus:top-2 focus:left-2 focus:z-50 focus:rounded-control focus:bg-panel focus:px-3 focus:py-2"
      >
        Skip to content
      </a>
      <aside className="border-edge bg-panel md:sticky md:top-0 md:flex md:h-dvh md:flex-col md:border-r print:hidden">
        <div className="flex items-center justify-between gap-3 border-b border-edge px-4 py-3 md:border-b-0 md:py-5">
          <Brand />
          <button
            type="button"
            className="rounded-control border border-edge-strong px-3 py-1.5 text-small font-medium text-ink md:hidden"
            aria-expanded={menuOpen}
            aria-controls={navId}
            onClick={() => setMenuOpen(!menuOpen)}
          >
            {menuOpen ? 'Close menu' : 'Menu'}
          </button>
        </div>
        <PrimaryNav
          id={navId}
          onNavigate={() => setMenuOpen(false)}
          className={`${menuOpen ? 'block' : 'hidden'} border-b border-edge px-3 pb-3 md:block md:flex-1 md:border-b-0 md:overflow-y-auto`}
        />
        <div
          className={`${menuOpen ? 'flex' : 'hidden'} flex-col gap-3 border-b border-edge px-4 py-3 md:flex md:border-t md:border-b-0`}
        >
          {userMenu}
          {status}
          <ThemeToggle />
        </div>
      </aside>
      <main
        id="main"
        tabIndex={-1}
        className="min-w-0 px-4 py-6 outline-none md:px-8 md:py-8 print:p-0"
      >
        <Suspense fallback={<PageLoading />}>
          <Outlet />
        </Suspense>
      </main>
    </div>
  );
}
