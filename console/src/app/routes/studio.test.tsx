import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { demoSession, stubApi } from '@/test/api-stub';
import { renderApp } from '@/test/render';
import { jsonResponse } from '@/test/responses';

// The permissions GET /v1/me gives each role, as server/src/auth/permissions.ts lists them.
const everyone = [
  'organization:read',
  'gear:read',
  'playground:use',
  'setups:read',
  'profile:manage',
];
const owner = {
  ...demoSession,
  role: 'owner' as const,
  permissions: [
    ...everyone,
    'organization:manage',
    'organization:delete',
    'organization:transfer',
    'billing:manage',
    'team:manage',
    'keys:manage-all',
    'keys:manage-own',
    'usage:read',
    'audit:read',
    'gear:manage',
    'setups:manage',
  ],
};
const admin = {
  ...owner,
  role: 'admin' as const,
  permissions: owner.permissions.filter(
    (p) => !/^organization:(manage|delete|transfer)$|^billing/.test(p),
  ),
};
const photographer = {
  ...demoSession,
  role: 'photographer' as const,
  permissions: [...everyone, 'setups:manage'],
};

// Invented members.
const members = [
  { userId: 'u-demo', name: 'Demo Owner', email: 'owner@studio.test', role: 'owner' },
  { userId: 'u-ash', name: 'Ash Fernley', email: 'ash@studio.test', role: 'admin' },
  { userId: 'u-tam', name: 'Tam Quillon', email: 'tam@studio.test', role: 'photographer' },
].map((m) => ({ ...m, joinedAt: '2026-01-01T00:00:00Z' }));
const seats = {
  limit: 10,
  used: 3,
  members: 3,
  pendingInvites: 0,
  planCode: 'free',
  planName: 'Free',
};

interface Sent {
  method: string;
  path: string;
  body: unknown;
}

function stub(session: typeof demoSession, answer?: (s: Sent) => Response | undefined) {
  const sent: Sent[] = [];
  stubApi(
    async (path, _init, request) => {
      if (path === '/v1/team/members') return jsonResponse({ data: members, seats });
      const text = await request.clone().text();
      const entry = { method: request.method, path, body: text ? JSON.parse(text) : undefined };
      sent.push(entry);
      const custom = answer?.(entry);
      if (custom) return custom;
      if (path === '/v1/organization' && request.method === 'PATCH') {
        return jsonResponse({ ...session.organization, ...(entry.body as object) });
      }
      if (path === '/v1/organization' || path === '/v1/organization/transfer-ownership') {
        return new Response(null, { status: 204 });
      }
      return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
    },
    undefined,
    session,
  );
  return { sent };
}

const card = async (name: string) =>
  (await screen.findByRole('heading', { level: 2, name })).closest('section') as HTMLElement;

describe('studio settings page', () => {
  it('lets the owner rename the studio with PATCH /v1/organization {name}', async () => {
    const { sent } = stub(owner);
    renderApp('/studio');
    const box = await card('Studio');
    const field = within(box).getByLabelText('Studio name') as HTMLInputElement;
    expect(field.value).toBe('Demo Studio');
    fireEvent.change(field, { target: { value: 'Harbour Dusk Studio' } });
    fireEvent.click(within(box).getByRole('button', { name: 'Save studio name' }));
    await within(box).findByText('The studio’s name is saved.');
    expect(sent).toEqual([
      { method: 'PATCH', path: '/v1/organization', body: { name: 'Harbour Dusk Studio' } },
    ]);
    // The shell's menu names the studio from the session, which the answer updated.
    expect(screen.getByRole('button', { name: /Harbour Dusk Studio · owner/ })).toBeTruthy();
  });

  it('shows a server refusal of the name on the field', async () => {
    stub(owner, () =>
      jsonResponse(
        {
          title: 'Unprocessable',
          status: 422,
          detail: 'name is invalid',
          errors: [{ field: 'name', reason: 'must be at most 100 characters' }],
        },
        422,
        'application/problem+json',
      ),
    );
    renderApp('/studio');
    const box = await card('Studio');
    fireEvent.change(within(box).getByLabelText('Studio name'), {
      target: { value: 'Renamed' },
    });
    fireEvent.click(within(box).getByRole('button', { name: 'Save studio name' }));
    await within(box).findByText('Must be at most 100 characters');
  });

  it('transfers ownership only after a question naming the person and what changes', async () => {
    // GET /v1/me reads this object on every call: after the transfer it says admin, as the server would.
    const session = { ...owner, permissions: [...owner.permissions] };
    const { sent } = stub(session, (s) => {
      if (s.path !== '/v1/organization/transfer-ownership') return undefined;
      Object.assign(session, { role: 'admin', permissions: admin.permissions });
      return new Response(null, { status: 204 });
    });
    renderApp('/studio');
    const box = await card('Transfer ownership');
    const select = (await within(box).findByLabelText('New owner')) as HTMLSelectElement;
    // You cannot hand the studio to yourself.
    expect([...select.options].map((o) => o.text)).toEqual([
      'Choose a member',
      'Ash Fernley (admin)',
      'Tam Quillon (photographer)',
    ]);
    const button = within(box).getByRole('button', { name: 'Transfer ownership' });
    expect((button as HTMLButtonElement).disabled).toBe(true);
    fireEvent.change(select, { target: { value: 'u-tam' } });
    fireEvent.click(button);
    let dialog = await screen.findByRole('dialog');
    expect(within(dialog).getByText('Make Tam Quillon the owner of Demo Studio?')).toBeTruthy();
    expect(dialog.textContent).toContain('You become an admin');
    expect(dialog.textContent).toContain('tam@studio.test');
    fireEvent.click(within(dialog).getByRole('button', { name: 'Cancel' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(sent).toEqual([]);

    fireEvent.click(button);
    dialog = await screen.findByRole('dialog');
    fireEvent.click(within(dialog).getByRole('button', { name: 'Make Tam Quillon owner' }));
    await screen.findByText('Tam Quillon now owns Demo Studio. You are an admin.');
    expect(sent).toEqual([
      { method: 'POST', path: '/v1/organization/transfer-ownership', body: { userId: 'u-tam' } },
    ]);
    // The session is read again: now an admin, the owner's cards go and the name is read-only.
    await waitFor(() =>
      expect(screen.queryByRole('heading', { name: 'Delete studio' })).toBeNull(),
    );
    expect(screen.queryByRole('heading', { name: 'Transfer ownership' })).toBeNull();
    expect(screen.getByText('Only the owner can rename the studio.')).toBeTruthy();
    expect(screen.getByText('Tam Quillon now owns Demo Studio. You are an admin.')).toBeTruthy();
  });

  it('deletes only once the exact name is typed; cancelling sends nothing', async () => {
    const { sent } = stub(owner);
    const { router } = renderApp('/studio');
    const box = await card('Delete studio');
    expect(box.textContent).toContain('every API key');
    fireEvent.click(within(box).getByRole('button', { name: 'Delete studio' }));
    let dialog = await screen.findByRole('dialog');
    const confirm = within(dialog).getByRole('button', { name: 'Delete studio' });
    const typed = within(dialog).getByLabelText('Type “Demo Studio” to confirm');
    expect((confirm as HTMLButtonElement).disabled).toBe(true);
    fireEvent.change(typed, { target: { value: 'demo studio' } });
    expect((confirm as HTMLButtonElement).disabled).toBe(true);
    fireEvent.click(within(dialog).getByRole('button', { name: 'Cancel' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(sent).toEqual([]);

    fireEvent.click(within(box).getByRole('button', { name: 'Delete studio' }));
    dialog = await screen.findByRole('dialog');
    fireEvent.change(within(dialog).getByLabelText('Type “Demo Studio” to confirm'), {
      target: { value: 'Demo Studio' },
    });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Delete studio' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(sent).toEqual([
      { method: 'DELETE', path: '/v1/organization', body: { confirmName: 'Demo Studio' } },
    ]);
    // The sign-in page says what happened, rather than appearing with no word.
    expect(await screen.findByText(/The studio was deleted/)).toBeTruthy();
  });

  it('shows the server’s 409 detail when the studio cannot be deleted, and stays', async () => {
    const detail = 'Other records still refer to this organisation; contact support.';
    stub(owner, (s) =>
      s.method === 'DELETE'
        ? jsonResponse({ title: 'Conflict', status: 409, detail }, 409, 'application/problem+json')
        : undefined,
    );
    const { router } = renderApp('/studio');
    const box = await card('Delete studio');
    fireEvent.click(within(box).getByRole('button', { name: 'Delete studio' }));
    const dialog = await screen.findByRole('dialog');
    fireEvent.change(within(dialog).getByLabelText('Type “Demo Studio” to confirm'), {
      target: { value: 'Demo Studio' },
    });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Delete studio' }));
    expect((await within(dialog).findByRole('alert')).textContent).toBe(detail);
    expect(router.state.location.pathname).toBe('/studio');
  });

  it('tells an owner on a paid plan to cancel the subscription before deleting', async () => {
    stub({ ...owner, organization: { ...owner.organization, planCode: 'studio' } });
    renderApp('/studio');
    const box = await card('Delete studio');
    fireEvent.click(within(box).getByRole('button', { name: 'Delete studio' }));
    const dialog = await screen.findByRole('dialog');
    expect(dialog.textContent).toContain('a studio with a running subscription cannot be deleted');
    expect(within(dialog).getByRole('link', { name: 'Billing' }).getAttribute('href')).toBe(
      '/billing',
    );
  });

  it.each([
    ['admin', admin],
    ['photographer', photographer],
  ] as const)(
    'shows an %s the studio read-only, with no transfer or delete',
    async (_, session) => {
      const { sent } = stub(session);
      renderApp('/studio');
      const box = await card('Studio');
      expect(within(box).getByText('Demo Studio')).toBeTruthy();
      expect(within(box).getByText('Only the owner can rename the studio.')).toBeTruthy();
      expect(screen.queryByLabelText('Studio name')).toBeNull();
      expect(screen.queryByRole('heading', { name: 'Transfer ownership' })).toBeNull();
      expect(screen.queryByRole('heading', { name: 'Delete studio' })).toBeNull();
      expect(sent).toEqual([]);
    },
  );

  it('is linked from the user menu for every role that may read the studio', async () => {
    stub(photographer);
    renderApp('/');
    fireEvent.click(await screen.findByRole('button', { name: /Demo Owner/ }));
    const link = await screen.findByRole('menuitem', { name: 'Studio settings' });
    expect(link.getAttribute('href')).toBe('/studio');
  });

  it('tells a session without organization:read that the section is not theirs', async () => {
    stub({ ...photographer, permissions: ['profile:manage'] });
    renderApp('/studio');
    await screen.findByText(/Your role in this studio doesn’t include this section/);
    expect(screen.queryByRole('heading', { level: 2, name: 'Studio' })).toBeNull();
  });
});
