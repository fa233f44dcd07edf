import { Link } from 'react-router-dom';
import { PageHeader } from '@/components/layout/page-header';
import { Card } from '@/components/ui/card';
import { paths } from '@/config/paths';
import { useCan } from '@/lib/session';

interface RequirePermissionProps {
  permission: string;
  title: string;
  children: React.ReactNode;
}

/** A section the role may not open: say so instead of showing a page of 403s. */
export function RequirePermission({ permission, title, children }: RequirePermissionProps) {
  const allowed = useCan(permission);
  if (allowed) return <>{children}</>;
  return (
    <>
      <PageHeader title={title} />
      <Card>
        <p>
          Your role in this studio doesn’t include this section. An owner or admin can change it.
        </p>
        <p className="mt-2">
          <Link to={paths.overview}>Back to the overview</Link>
        </p>
      </Card>
    </>
  );
}
