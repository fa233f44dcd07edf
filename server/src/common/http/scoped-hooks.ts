// Some plugins add global hooks that only a few requests need: the console session's hooks (never
// needed by bearer-key callers, the metered hot path) and the multipart plugin's temp-file
// cleanup (only multipart uploads have files). Registering such a plugin through `scopedHooks`
// wraps every hook it adds so the hook runs only for requests `applies` accepts; for the rest the
// hook finishes at once.
import type {
  FastifyInstance,
  onRequestHookHandler,
  onResponseHookHandler,
  onSendHookHandler,
  RouteOptions,
} from 'fastify';

export interface HookRequest {
  headers: Record<string, string | string[] | undefined>;
}

type HookFn = (req: HookRequest, reply: unknown, a?: unknown, b?: unknown) => unknown;

/** Wraps a hook so it runs only when `applies(req)`; otherwise it calls its `done` at once. */
export function onlyWhen(applies: (req: HookRequest) => boolean, fn: HookFn): HookFn {
  // Fixed arity (no rest array on the hot path): Fastify calls hooks with (req, reply, done), or
  // (req, reply, payload, done) for onSend and the like — `done` last, also for async hooks.
  const wrapped = function (
    this: unknown,
    req: HookRequest,
    reply: unknown,
    a?: unknown,
    b?: unknown,
  ) {
    if (applies(req)) return fn.call(this, req, reply, a, b);
    const done = typeof b === 'function' ? b : a;
    if (typeof done === 'function') return (done as () => void)();
    return undefined;
  };
  Object.defineProperty(wrapped, 'name', { value: `onlyWhen(${fn.name || 'hook'})` });
  return wrapped;
}

/** Runs `register` with every hook it adds to `fastify` wrapped by `onlyWhen(applies, …)`. */
export async function scopedHooks(
  fastify: FastifyInstance,
  applies: (req: HookRequest) => boolean,
  register: () => PromiseLike<unknown>,
): Promise<void> {
  const addHook = fastify.addHook.bind(fastify) as (name: string, fn: unknown) => unknown;
  (fastify as unknown as { addHook: unknown }).addHook = (name: string, fn: unknown) =>
    addHook(name, typeof fn === 'function' ? onlyWhen(applies, fn as HookFn) : fn);
  try {
    await register();
  } finally {
    (fastify as unknown as { addHook: unknown }).addHook = addHook;
  }
}

/** True for a request that authenticates with a bearer key and carries no cookie. */
export function isBearerOnly(req: HookRequest): boolean {
  const auth = req.headers.authorization;
  return typeof auth === 'string' && /^Bearer\s/i.test(auth) && !req.headers.cookie;
}

/** True for a multipart/form-data request (a frame upload). */
export function isMultipart(req: HookRequest): boolean {
  const type = req.headers['content-type'];
  return typeof type === 'string' && /^multipart\/form-data/i.test(type);
}

/** Adds `hook` after a route's own hooks of that kind (from an `onRoute` hook, as routes are added). */
export function appendRouteHook(
  route: RouteOptions,
  kind: 'onRequest',
  hook: onRequestHookHandler,
): void;
export function appendRouteHook(
  route: RouteOptions,
  kind: 'onResponse',
  hook: onResponseHookHandler,
): void;
export function appendRouteHook(route: RouteOptions, kind: 'onSend', hook: onSendHookHandler): void;
export function appendRouteHook(
  route: RouteOptions,
  kind: 'onRequest' | 'onResponse' | 'onSend',
  hook: unknown,
): void {
  const own: unknown = route[kind];
  const list = own === undefined ? [] : Array.isArray(own) ? [...(own as unknown[])] : [own];
  (route as unknown as Record<string, unknown[]>)[kind] = [...list, hook];
}
