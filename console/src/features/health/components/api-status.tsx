import { useApiStatus } from '../api/get-health';

const dotClass = {
  checking: 'bg-ink-muted',
  up: 'bg-ok',
  down: 'bg-fault',
} as const;

/** A small live badge: is the API answering, and is its database up? */
export function ApiStatus() {
  const { data, isPending, isError } = useApiStatus();
  const state = isPending ? 'checking' : isError || !data ? 'down' : data.state;
  const text =
    state === 'checking'
      ? 'Checking API…'
      : state === 'up'
        ? 'API up'
        : `API down${data?.state === 'down' ? ` (${data.reason})` : ''}`;

  return (
    <p
      role="status"
      aria-live="polite"
      data-state={state}
      className="flex items-center gap-2 text-small text-ink-muted"
    >
      <span
        aria-hidden="true"
        className={`inline-block size-2.5 rounded-full ${dotClass[state]}`}
      />
      <span className={state === 'down' ? 'text-fault' : undefined}>{text}</span>
    </p>
  );
}
