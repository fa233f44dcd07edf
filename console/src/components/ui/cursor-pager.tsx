import { useSearchParams } from 'react-router-dom';
import { hasPreviousPage, nextPageParams, previousPageParams } from '@/lib/pagination';
import { Button } from './button';

interface CursorPagerProps {
  nextCursor: string | null | undefined;
  label: string;
}

/** Previous / Next for a cursor-paged list; the position lives in the URL (see lib/pagination). */
export function CursorPager({ nextCursor, label }: CursorPagerProps) {
  const [params, setParams] = useSearchParams();
  const hasPrevious = hasPreviousPage(params);
  if (!hasPrevious && !nextCursor) return null;
  return (
    <nav aria-label={`${label} pages`} className="mt-3 flex justify-end gap-2">
      <Button
        variant="secondary"
        disabled={!hasPrevious}
        onClick={() => setParams(previousPageParams(params))}
      >
        Previous
      </Button>
      <Button
        variant="secondary"
        disabled={!nextCursor}
        onClick={() => nextCursor && setParams(nextPageParams(params, nextCursor))}
      >
        Next
      </Button>
    </nav>
  );
}
