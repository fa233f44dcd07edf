import { fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';

afterEach(() => {
  delete document.documentElement.dataset.theme;
});

/** A fresh copy of the theme modules, as after a page reload. */
async function loadFresh() {
  vi.resetModules();
  const theme = await import('@/lib/theme');
  const { ThemeToggle } = await import('./theme-toggle');
  return { ...theme, ThemeToggle };
}

describe('theme toggle', () => {
  it('switches to night, marks <html>, and stores the choice', async () => {
    const { ThemeToggle, THEME_STORAGE_KEY } = await loadFresh();
    render(<ThemeToggle />);
    const toggle = screen.getByRole('switch', { name: 'Night theme' });
    expect(toggle.getAttribute('aria-checked')).toBe('false');

    fireEvent.click(toggle);

    expect(toggle.getAttribute('aria-checked')).toBe('true');
    expect(document.documentElement.dataset.theme).toBe('night');
    expect(window.localStorage.getItem(THEME_STORAGE_KEY)).toBe('night');
  });

  it('comes back as night after a reload, and can be switched back to day', async () => {
    const first = await loadFresh();
    first.themePreference.set('night');

    const { ThemeToggle, themePreference, applyTheme, THEME_STORAGE_KEY } = await loadFresh();
    expect(themePreference.get()).toBe('night');
    applyTheme(themePreference.get());
    render(<ThemeToggle />);
    const toggle = screen.getByRole('switch', { name: 'Night theme' });
    expect(toggle.getAttribute('aria-checked')).toBe('true');
    expect(document.documentElement.dataset.theme).toBe('night');

    fireEvent.click(toggle);
    expect(window.localStorage.getItem(THEME_STORAGE_KEY)).toBe('day');
    expect(document.documentElement.dataset.theme).toBe('day');
  });

  it('ignores a stored value that is not a theme', async () => {
    window.localStorage.setItem('lumenwright.theme', 'sepia');
    const { themePreference } = await loadFresh();
    expect(['day', 'night']).toContain(themePreference.get());
    expect(themePreference.get()).not.toBe('sepia');
  });
});
