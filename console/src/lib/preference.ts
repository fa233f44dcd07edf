import { useSyncExternalStore } from 'react';

/**
 * A small value remembered in localStorage and shared by every component that reads it.
 * Storage can be unavailable (private windows, blocked cookies): the value then lives in memory.
 */
export interface Preference<T extends string> {
  get(): T;
  set(value: T): void;
  subscribe(listener: () => void): () => void;
}

export function createPreference<T extends string>(
  storageKey: string,
  allowed: readonly T[],
  fallback: () => T,
): Preference<T> {
  const listeners = new Set<() => void>();
  let current: T | undefined;

  const read = (): T => {
    try {
      const stored = window.localStorage.getItem(storageKey);
      if (stored !== null && (allowed as readonly string[]).includes(stored)) return stored as T;
    } catch {
      // storage blocked: fall through to the default
    }
    return fallback();
  };

  return {
    get() {
      current ??= read();
      return current;
    },
    set(value) {
      current = value;
      try {
        window.localStorage.setItem(storageKey, value);
      } catch {
        // storage blocked: keep the in-memory value for this visit
      }
      listeners.forEach((listener) => listener());
    },
    subscribe(listener) {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
  };
}

export function usePreference<T extends string>(preference: Preference<T>): [T, (value: T) => void] {
  const value = useSyncExternalStore(preference.subscribe, preference.get, preference.get);
  return [value, preference.set];
}
