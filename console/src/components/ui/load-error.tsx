import { problemMessage } from '@/lib/form-errors';
import { Button } from './button';
import { Notice } from './notice';

interface LoadErrorProps {
  /** What the query failed with (a problem answer's detail is shown as it came). */
  error: unknown;
  /** Fetches again; the button shows "Trying…" until the answer comes. */
  onRetry: () => unknown;
  retrying?: boolean;
  className?: string;
}

/** A list or figure that could not be loaded: why, and a way forward ("Try again"). */
export function LoadError({ error, onRetry, retrying = false, className = '' }: LoadErrorProps) {
  return (
    <Notice tone="fault" className={className}>
      <span className="flex flex-wrap items-center justify-between gap-x-4 gap-y-2">
        <span>{problemMessage(error)}</span>
        <Button variant="secondary" size="sm" disabled={retrying} onClick={() => void onRetry()}>
          {retrying ? 'Trying…' : 'Try again'}
        </Button>
      </span>
    </Notice>
  );
}
