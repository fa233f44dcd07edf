export function PageLoading() {
  return (
    <p role="status" className="text-ink-muted">
      Loading…
    </p>
  );
}
