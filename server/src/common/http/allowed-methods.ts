// Which methods a path answers to, for 405 Method Not Allowed with its Allow header (RFC 9110
// §15.5.6): a second router (find-my-way, the router Fastify itself uses) holding every API route
// as it is registered, asked only when a request found no route.
import type { FastifyInstance, RouteOptions } from 'fastify';
import FindMyWay, { type HTTPMethod } from 'find-my-way';

const ORDER = ['GET', 'HEAD', 'POST', 'PUT', 'PATCH', 'DELETE'] as const;

export class AllowedMethods {
  private readonly router = FindMyWay({ ignoreTrailingSlash: true });
  private readonly seen = new Set<string>();

  /** Records a route; catch-all routes (the console's pages, CORS preflight) are left out. */
  record(method: string | string[], url: string): void {
    if (!url.startsWith('/v1/') || url.includes('*')) return;
    for (const m of Array.isArray(method) ? method : [method]) {
      const upper = m.toUpperCase();
      if (!(ORDER as readonly string[]).includes(upper) || this.seen.has(`${upper} ${url}`))
        continue;
      this.seen.add(`${upper} ${url}`);
      this.router.on(upper as HTTPMethod, url, () => undefined);
    }
  }

  /** The methods `path` answers to, in a fixed order; empty when no route has this path. */
  for(path: string): string[] {
    const found = ORDER.filter((m) => this.router.find(m, path) !== null);
    // Fastify answers HEAD wherever it answers GET.
    if (found.includes('GET') && !found.includes('HEAD')) found.splice(1, 0, 'HEAD');
    return found;
  }
}

declare module 'fastify' {
  interface FastifyInstance {
    allowedMethods: AllowedMethods;
  }
}

/** Call before any route is registered: every later route is recorded. */
export function trackAllowedMethods(fastify: FastifyInstance): AllowedMethods {
  const allowed = new AllowedMethods();
  fastify.decorate('allowedMethods', allowed);
  fastify.addHook('onRoute', (route: RouteOptions) => allowed.record(route.method, route.url));
  return allowed;
}
