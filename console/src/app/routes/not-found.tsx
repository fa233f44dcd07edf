import { Link } from 'react-router-dom';
import { PageHeader } from '@/components/layout/page-header';
import { paths } from '@/config/paths';

export default function NotFoundRoute() {
  return (
    <>
      <PageHeader title="Page not found" lead="Nothing lives at this address." />
      <p>
        <Link to={paths.overview}>Back to the overview</Link>
      </p>
    </>
  );
}
