import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { demoSession, stubApi } from '@/test/api-stub';
import { renderApp } from '@/test/render';
import { jsonResponse } from '@/test/responses';

// Invented people and studios.
const otherStudio = {
  id: '00000000-0000-4000-8000-0000000000d2',
  name: 'Second Light Co-op',
  planCode: 'studio',
  createdAt: '2026-02-01T00:00:00Z',
};
const problem = (status: number, detail: string, errors?: { field: string; reason: string }[]) =>
  jsonResponse(
    { type: 'about:blank', title: 'Refused', status, detail, ...(errors && { errors }) },
    status,
    'application/problem+json',
  );

interface Sent {
  method: string;
  path: string;
  body: unknown;
}

/** Records every write; `answer` decides the reply to one (default: a plausible success). */
function stub(
  answer?: (sent: Sent) => Response | undefined,
  session = demoSession,
  pendingEmail: string | null = null,
) {
  const sent: Sent[] = [];
  const mock = stubApi(
    async (path, _init, request) => {
      if (path === '/v1/me/email' && request.method === 'GET') {
        return jsonResponse({
          email: session.user.email,
          pendingEmail,
          pendingUntil: pendingEmail ? '2026-12-04T09:00:00.000Z' : null,
        });
      }
      if (path === '/v1/me/organizations' && request.method === 'GET') {
        return jsonResponse({
          data: [
            { organization: session.organization, role: session.role, current: true },
            { organization: otherStudio, role: 'photographer', current: false },
          ],
        });
      }
      const text = await request.clone().text();
      const entry = { method: request.method, path, body: text ? JSON.parse(text) : undefined };
      sent.push(entry);
      const custom = answer?.(entry);
      if (custom) return custom;
      if (path === '/v1/me' && request.method === 'PATCH') {
        const body = entry.body as { name?: string; preferences?: { lengthUnit: 'm' | 'ft' } };
        return jsonResponse({
          ...session,
          user: { ...session.user, name: body.name ?? session.user.name },
          preferences: { ...session.preferences, ...body.preferences },
        });
      }
      if (path === '/v1/me/email') return jsonResponse({ message: 'Open the link.' }, 202);
      if (path === '/v1/me/organization') {
        return jsonResponse({ ...session, organization: otherStudio, role: 'photographer' });
      }
      if (path === '/v1/me/password' || path === '/v1/auth/sign-out-everywhere') {
        return new Response(null, { status: 204 });
      }
      return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
    },
    undefined,
    session,
  );
  return { mock, sent };
}

const section = async (name: string) =>
  (await screen.findByRole('heading', { level: 2, name })).closest('section') as HTMLElement;

describe('account page', () => {
  it('saves a new name with PATCH /v1/me {name} and shows it in the user menu', async () => {
    const { sent } = stub();
    renderApp('/account');
    const profile = await section('Profile');
    const name = within(profile).getByLabelText('Your name') as HTMLInputElement;
    expect(name.value).toBe('Demo Owner');
    fireEvent.change(name, { target: { value: '  Wren Hollowell ' } });
    fireEvent.click(within(profile).getByRole('button', { name: 'Save name' }));
    await within(profile).findByText('Your name is saved.');
    // The zod schema trims, as the server does.
    expect(sent).toEqual([{ method: 'PATCH', path: '/v1/me', body: { name: 'Wren Hollowell' } }]);
    expect(screen.getByRole('button', { name: /Wren Hollowell/ })).toBeTruthy();
  });

  it('switches metres to feet with PATCH /v1/me {preferences: {lengthUnit}}', async () => {
    const { sent } = stub();
    renderApp('/account');
    const profile = await section('Profile');
    fireEvent.click(within(profile).getByRole('radio', { name: 'Feet' }));
    await waitFor(() => expect(sent).toHaveLength(1));
    expect(sent[0]).toEqual({
      method: 'PATCH',
      path: '/v1/me',
      body: { preferences: { lengthUnit: 'ft' } },
    });
    await waitFor(() =>
      expect(
        within(profile).getByRole('radio', { name: 'Feet' }).getAttribute('aria-checked'),
      ).toBe('true'),
    );
  });

  it('asks for an e-mail change, then shows the address waiting in the inbox', async () => {
    const { sent } = stub();
    renderApp('/account');
    const email = await section('Email');
    fireEvent.change(within(email).getByLabelText('New email'), {
      target: { value: 'wren@studio.test' },
    });
    fireEvent.change(within(email).getByLabelText('Password'), {
      target: { value: 'long-dusk-phrase' },
    });
    fireEvent.click(within(email).getByRole('button', { name: 'Send confirmation link' }));
    const notice = await within(email).findByText(/Check your inbox at/);
    expect(notice.textContent).toContain('wren@studio.test');
    expect(notice.textContent).toContain('keep signing in with owner@studio.test');
    expect(sent).toEqual([
      {
        method: 'POST',
        path: '/v1/me/email',
        body: { newEmail: 'wren@studio.test', password: 'long-dusk-phrase' },
      },
    ]);
  });

  it('shows a change still waiting for its link on a later visit, from the server', async () => {
    stub(undefined, demoSession, 'moved@studio.test');
    renderApp('/account');
    const email = await section('Email');
    const notice = await within(email).findByText(/Check your inbox at/);
    expect(notice.textContent).toContain('moved@studio.test');
    // Another address can still be asked for.
    fireEvent.click(within(email).getByRole('button', { name: 'Use another address' }));
    expect(within(email).getByLabelText('New email')).toBeTruthy();
  });

  it('puts the server’s refusal of an e-mail change on the fields it names', async () => {
    stub((s) =>
      s.path === '/v1/me/email'
        ? problem(409, 'An account with that address exists.', [
            { field: 'newEmail', reason: 'is taken' },
          ])
        : undefined,
    );
    renderApp('/account');
    const email = await section('Email');
    fireEvent.change(within(email).getByLabelText('New email'), {
      target: { value: 'taken@studio.test' },
    });
    fireEvent.change(within(email).getByLabelText('Password'), { target: { value: 'x' } });
    fireEvent.click(within(email).getByRole('button', { name: 'Send confirmation link' }));
    await within(email).findByText('Is taken');
    expect(within(email).getByLabelText('New email').getAttribute('aria-invalid')).toBe('true');
    expect(within(email).queryByText(/Check your inbox/)).toBeNull();
  });

  it('changes the password with both passwords, and shows server field errors inline', async () => {
    let refuse = true;
    const { sent } = stub((s) =>
      s.path === '/v1/me/password' && refuse
        ? problem(422, 'The current password is wrong.', [
            { field: 'currentPassword', reason: 'is wrong' },
          ])
        : undefined,
    );
    renderApp('/account');
    const box = await section('Password');
    const fill = (current: string, next: string, repeat: string) => {
      fireEvent.change(within(box).getByLabelText('Current password'), {
        target: { value: current },
      });
      fireEvent.change(within(box).getByLabelText('New password'), { target: { value: next } });
      fireEvent.change(within(box).getByLabelText('Repeat the new password'), {
        target: { value: repeat },
      });
      fireEvent.click(within(box).getByRole('button', { name: 'Change password' }));
    };

    // Caught before any request: too short, then the two new passwords differ.
    fill('old-password-1', 'short', 'short');
    await within(box).findByText('Use at least 10 characters');
    fill('old-password-1', 'evening-window-light', 'evening-window-lite');
    await within(box).findByText('The two passwords differ');
    expect(sent).toEqual([]);

    fill('not-my-password', 'evening-window-light', 'evening-window-light');
    await within(box).findByText('Is wrong');
    expect(within(box).getByLabelText('Current password').getAttribute('aria-invalid')).toBe(
      'true',
    );
    expect(sent).toEqual([
      {
        method: 'POST',
        path: '/v1/me/password',
        body: { currentPassword: 'not-my-password', newPassword: 'evening-window-light' },
      },
    ]);

    refuse = false;
    fill('old-password-1', 'evening-window-light', 'evening-window-light');
    await within(box).findByText(/Your password is changed/);
    expect(sent).toHaveLength(2);
    expect((within(box).getByLabelText('Current password') as HTMLInputElement).value).toBe('');
  });

  it('signs out everywhere only after the confirmation, then goes to sign-in', async () => {
    const { sent } = stub();
    const { router } = renderApp('/account');
    const box = await section('Sessions');
    fireEvent.click(within(box).getByRole('button', { name: 'Sign out everywhere' }));
    let dialog = await screen.findByRole('dialog');
    expect(dialog.textContent).toContain('this one included');
    fireEvent.click(within(dialog).getByRole('button', { name: 'Cancel' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(sent).toEqual([]);

    fireEvent.click(within(box).getByRole('button', { name: 'Sign out everywhere' }));
    dialog = await screen.findByRole('dialog');
    fireEvent.click(within(dialog).getByRole('button', { name: 'Sign out everywhere' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(sent).toEqual([
      { method: 'POST', path: '/v1/auth/sign-out-everywhere', body: undefined },
    ]);
  });

  it('lists the studios you belong to and switches this session to another', async () => {
    const { sent } = stub();
    renderApp('/account');
    const box = await section('Your studios');
    await within(box).findByText('Second Light Co-op');
    expect(within(box).getByText('Current')).toBeTruthy();
    expect(within(box).queryByRole('button', { name: 'Switch to Demo Studio' })).toBeNull();
    fireEvent.click(within(box).getByRole('button', { name: 'Switch to Second Light Co-op' }));
    await within(box).findByText('You now work in Second Light Co-op.');
    expect(sent).toEqual([
      {
        method: 'POST',
        path: '/v1/me/organization',
        body: { organizationId: otherStudio.id },
      },
    ]);
    // The user menu follows the session to the other studio and role.
    expect(screen.getByRole('button', { name: /Second Light Co-op · photographer/ })).toBeTruthy();
  });

  it('is open to a photographer too, and linked from the user menu', async () => {
    stub(undefined, {
      ...demoSession,
      role: 'photographer',
      permissions: ['organization:read', 'profile:manage', 'setups:manage'],
    });
    renderApp('/');
    fireEvent.click(await screen.findByRole('button', { name: /Demo Owner/ }));
    const link = await screen.findByRole('menuitem', { name: 'Account' });
    expect(link.getAttribute('href')).toBe('/account');
    fireEvent.click(link);
    expect(await screen.findByRole('heading', { level: 1, name: 'Account' })).toBeTruthy();
    expect(screen.getByLabelText('Your name')).toBeTruthy();
  });

  it('closes the phone menu when the user menu leads to another page', async () => {
    stub();
    renderApp('/');
    const toggle = await screen.findByRole('button', { name: 'Menu' });
    fireEvent.click(toggle);
    expect(toggle.getAttribute('aria-expanded')).toBe('true');
    fireEvent.click(await screen.findByRole('button', { name: /Demo Owner/ }));
    fireEvent.click(await screen.findByRole('menuitem', { name: 'Account' }));
    await screen.findByRole('heading', { level: 1, name: 'Account' });
    expect(toggle.getAttribute('aria-expanded')).toBe('false');
    expect(screen.getByLabelText('Your name')).toBeTruthy();
  });
});
