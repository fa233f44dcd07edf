import { Navigate, useLocation } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { PageLoading } from '@/components/ui/page-loading';
import { paths } from '@/config/paths';
import { ApiProblem } from '@/lib/api';
import { problemMessage } from '@/lib/form-errors';
import { SessionContext } from '@/lib/session';
import { useMe } from '../api/me';
import { signInPath } from '../redirect';

/** Loads GET /v1/me; without a session (401) it sends the visitor to sign in, then back here. */
export function SessionGate({ children }: { children: React.ReactNode }) {
  const me = useMe();
  const location = useLocation();

  if (me.isPending) {
    return (
      <div className="p-8">
        <PageLoading />
      </div>
    );
  }
  if (me.isError) {
    if (me.error instanceof ApiProblem && me.error.status === 401) {
      return <Navigate to={signInPath(location, paths.signIn)} replace />;
    }
    return (
      <div className="mx-auto max-w-md p-8">
        <Notice tone="fault">{problemMessage(me.error)}</Notice>
        <Button className="mt-4" onClick={() => void me.refetch()}>
          Try again
        </Button>
      </div>
    );
  }
  return <SessionContext value={me.data}>{children}</SessionContext>;
}
