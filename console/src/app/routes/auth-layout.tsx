import { Suspense } from 'react';
import { Outlet } from 'react-router-dom';
import { Brand } from '@/components/layout/brand';
import { ThemeToggle } from '@/components/layout/theme-toggle';
import { PageLoading } from '@/components/ui/page-loading';

/** Sign-in and sign-up sit outside the app shell: no navigation until you have a studio. */
export function AuthLayout() {
  return (
    <div className="flex min-h-dvh flex-col items-center px-4 py-8">
      <header className="flex w-full max-w-md items-center justify-between">
        <Brand />
        <ThemeToggle />
      </header>
      <main id="main" className="mt-10 w-full max-w-md">
        <Suspense fallback={<PageLoading />}>
          <Outlet />
        </Suspense>
      </main>
    </div>
  );
}
