// Values that are ready at once on the hot path (a cached key, plan or quota lease) and need a
// database round trip otherwise. Returning them without a promise spares every metered call the
// promises and microtask hops of `async`/`await` when nothing is awaited; Nest's guard runner
// takes a plain boolean as it is.
export type MaybePromise<T> = T | Promise<T>;

export function isPromise<T>(value: MaybePromise<T>): value is Promise<T> {
  return value instanceof Promise;
}
