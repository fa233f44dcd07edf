import { screen, within } from '@testing-library/react';
import { beforeEach, describe, expect, it } from 'vitest';
import { primaryNav } from '@/config/paths';
import { stubApi } from '@/test/api-stub';
import { renderApp } from '@/test/render';

beforeEach(() => {
  stubApi();
});

describe('app shell', () => {
  it('renders every section of the primary navigation as a link with its path', async () => {
    renderApp('/');
    const nav = await screen.findByRole('navigation', { name: 'Primary' });
    const links = within(nav).getAllByRole('link');
    expect(links.map((link) => [link.textContent, link.getAttribute('href')])).toEqual(
      primaryNav.map((entry) => [entry.label, entry.to]),
    );
    // The sections the skeleton was asked for are all there.
    const hrefs = links.map((link) => link.getAttribute('href'));
    for (const href of [
      '/',
      '/keys',
      '/usage',
      '/playground',
      '/setups',
      '/gear',
      '/team',
      '/billing',
    ]) {
      expect(hrefs).toContain(href);
    }
    expect(await screen.findByRole('heading', { level: 1, name: 'Overview' })).toBeTruthy();
  });

  it.each(primaryNav.map((entry) => [entry.to, entry.label] as const))(
    '%s shows one h1 and marks its nav link as the current page',
    async (path, label) => {
      renderApp(path);
      // Sections load as separate chunks; the first import of a big one can take a while here.
      const heading = await screen.findByRole('heading', { level: 1 }, { timeout: 5000 });
      expect(heading.textContent).toBe(label);
      expect(screen.getAllByRole('heading', { level: 1 })).toHaveLength(1);
      const nav = await screen.findByRole('navigation', { name: 'Primary' });
      const current = within(nav).getByRole('link', { current: 'page' });
      expect(current.textContent).toBe(label);
    },
  );

  it('shows a 404 page with a heading for unknown addresses, inside the shell', async () => {
    renderApp('/no-such-place');
    expect(await screen.findByRole('heading', { level: 1, name: 'Page not found' })).toBeTruthy();
    expect(await screen.findByRole('navigation', { name: 'Primary' })).toBeTruthy();
  });

  it.each([
    ['/sign-in', 'Sign in'],
    ['/sign-up', 'Create a studio account'],
  ])('%s has its own heading and no app navigation', async (path, title) => {
    renderApp(path);
    expect(await screen.findByRole('heading', { level: 1, name: title })).toBeTruthy();
    expect(screen.queryByRole('navigation', { name: 'Primary' })).toBeNull();
  });

  it('offers a skip link to the main content', async () => {
    renderApp('/');
    const skip = await screen.findByRole('link', { name: 'Skip to content' });
    expect(skip.getAttribute('href')).toBe('#main');
    expect(document.getElementById('main')?.tagName).toBe('MAIN');
  });
});
