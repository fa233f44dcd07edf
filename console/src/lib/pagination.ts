/**
 * Cursor pagination kept in the URL: `cursor` is the page being shown and `trail` the cursors
 * of the pages before it (comma-separated), so Back, reload and shared links all land on the same
 * page, and "Previous" needs no server support.
 */
export const CURSOR_PARAM = 'cursor';
export const TRAIL_PARAM = 'trail';

export function currentCursor(params: URLSearchParams): string | undefined {
  return params.get(CURSOR_PARAM) || undefined;
}

function readTrail(params: URLSearchParams): string[] {
  const raw = params.get(TRAIL_PARAM);
  // An empty entry stands for the first page (no cursor).
  return raw === null ? [] : raw.split(',');
}

export function hasPreviousPage(params: URLSearchParams): boolean {
  return params.has(CURSOR_PARAM);
}

/** The URL for the page after this one. */
export function nextPageParams(params: URLSearchParams, nextCursor: string): URLSearchParams {
  const next = new URLSearchParams(params);
  next.set(TRAIL_PARAM, [...readTrail(params), currentCursor(params) ?? ''].join(','));
  next.set(CURSOR_PARAM, nextCursor);
  return next;
}

/** The URL for the page before this one (the first page has neither param). */
export function previousPageParams(params: URLSearchParams): URLSearchParams {
  const next = new URLSearchParams(params);
  const trail = readTrail(params);
  const previous = trail.pop();
  if (!previous) {
    next.delete(CURSOR_PARAM);
    next.delete(TRAIL_PARAM);
    return next;
  }
  next.set(CURSOR_PARAM, previous);
  next.set(TRAIL_PARAM, trail.join(','));
  return next;
}

/** Back to the first page, e.g. when a filter changes. */
export function firstPageParams(params: URLSearchParams): URLSearchParams {
  const next = new URLSearchParams(params);
  next.delete(CURSOR_PARAM);
  next.delete(TRAIL_PARAM);
  return next;
}
