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
  // Only used when storage refuses the write; otherwise storage is the single source of truth.
  let unsaved: T | undefined;

  const stored = (): T | undefined => {
    try {
      const value = window.localStorage.getItem(storageKey);
      if (value !== null && (allowed as readonly string[]).includes(value)) return value as T;
    } catch {
      // storage blocked: fall back to the in-memory value
    }
    return undefined;
  };

  return {
    get() {
      return stored() ?? unsaved ?? fallback();
    },
    set(value) {
      try {
        window.localStorage.setItem(storageKey, value);
        unsaved = undefined;
      } catch {
        unsaved = value;
      }
      listeners.forEach((listener) => listener());
    },
    subscribe(listener) {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
  };
}

export function usePreference<T extends string>(
  preference: Preference<T>,
): [T, (value: T) => void] {
  const value = useSyncExternalStore(preference.subscribe, preference.get, preference.get);
  return [value, preference.set];
}
