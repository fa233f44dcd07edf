/**
 * Where to go after signing in: the `next` parameter when it is a path on this site, else home.
 * Anything else (`//elsewhere.test`, `https://…`, `javascript:`) is ignored, so a crafted sign-in
 * link cannot send people off-site.
 */
export function safeNext(next: string | null | undefined, fallback = '/'): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) {
    return fallback;
  }
  return next;
}

/** The sign-in address that brings the visitor back to `location` afterwards. */
export function signInPath(location: { pathname: string; search: string }, signIn = '/sign-in') {
  const here = `${location.pathname}${location.search}`;
  return here === '/' ? signIn : `${signIn}?next=${encodeURIComponent(here)}`;
}
