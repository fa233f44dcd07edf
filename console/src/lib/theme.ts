import { createPreference, usePreference } from './preference';

export const THEMES = ['day', 'night'] as const;
export type Theme = (typeof THEMES)[number];
export const THEME_STORAGE_KEY = 'lumenwright.theme';

/** Day unless the person asked their system for a dark scheme. */
function defaultTheme(): Theme {
  try {
    return window.matchMedia('(prefers-color-scheme: dark)').matches ? 'night' : 'day';
  } catch {
    return 'day';
  }
}

export const themePreference = createPreference<Theme>(THEME_STORAGE_KEY, THEMES, defaultTheme);

export function applyTheme(theme: Theme, root: HTMLElement = document.documentElement): void {
  root.dataset.theme = theme;
}

// Keep <html data-theme> in step with the stored choice from the first paint on.
themePreference.subscribe(() => applyTheme(themePreference.get()));

export function useTheme(): [Theme, (theme: Theme) => void] {
  return usePreference(themePreference);
}
