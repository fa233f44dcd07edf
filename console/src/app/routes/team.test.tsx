import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { demoSession, stubApi } from '@/test/api-stub';
import { renderApp } from '@/test/render';
import { jsonResponse } from '@/test/responses';

// Invented people and plans.
const owner = {
  userId: 'u-demo',
  name: 'Demo Owner',
  email: 'owner@studio.test',
  role: 'owner',
  joinedAt: '2026-01-01T00:00:00Z',
};
const pending = {
  id: '00000000-0000-4000-8000-0000000000c1',
  email: 'wren@studio.test',
  role: 'photographer',
  status: 'pending',
  invitedBy: 'Demo Owner',
  expiresAt: '2026-12-10T00:00:00Z',
  lastSentAt: '2026-12-03T00:00:00Z',
  createdAt: '2026-12-03T00:00:00Z',
};
const seats = (limit: number, members: number, pendingInvites: number, planName = 'Studio') => ({
  limit,
  used: members + pendingInvites,
  members,
  pendingInvites,
  planCode: planName.toLowerCase(),
  planName,
});
const refusal = {
  type: 'https://lumenwright.test/problems/conflict',
  title: 'Conflict',
  status: 409,
  detail:
    'Your plan has 2 seats: 1 member and 1 pending invite. Remove a member, cancel an invite or change plan.',
  limit: 'seats',
  limitValue: 2,
  count: 2,
  members: 1,
  pendingInvites: 1,
  planCode: 'free',
};

/** GET members/invites answer from `state`; POST /v1/team/invites answers `onInvite`. */
function stub(state: { seats: ReturnType<typeof seats> }, onInvite?: () => Response) {
  const posts: unknown[] = [];
  const mock = stubApi(async (path, _init, request) => {
    if (path === '/v1/team/invites' && request.method === 'POST') {
      posts.push(await request.clone().json());
      return onInvite ? onInvite() : jsonResponse(pending, 201);
    }
    if (path === '/v1/team/members') return jsonResponse({ data: [owner], seats: state.seats });
    if (path === '/v1/team/invites') return jsonResponse({ data: [] });
    return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
  });
  return { mock, posts };
}

const sendButton = () => screen.getByRole('button', { name: 'Send invitation' });

describe('team page seats', () => {
  it('shows the seats used of the plan’s and leaves the invitation open while one is free', async () => {
    stub({ seats: seats(10, 2, 1) });
    renderApp('/team');
    const summary = await screen.findByTestId('seats-summary');
    expect(summary.textContent).toBe(
      '3 of 10 seats used (2 members, 1 pending invitation) on the Studio plan.',
    );
    expect((sendButton() as HTMLButtonElement).disabled).toBe(false);
    expect(screen.queryByText(/are taken/)).toBeNull();
  });

  it('closes the invitation when the seats are full, says why, and links an owner to Billing', async () => {
    const { posts } = stub({ seats: seats(2, 1, 1, 'Free') });
    renderApp('/team');
    await screen.findByText('2 of 2 seats used');
    await waitFor(() => expect((sendButton() as HTMLButtonElement).disabled).toBe(true));
    const reason = screen.getByText('All 2 seats of the Free plan are taken.');
    const notice = reason.closest('[role="status"]') as HTMLElement;
    expect(notice.textContent).toContain('remove a member or cancel a pending invitation');
    expect(within(notice).getByRole('link', { name: 'Billing' }).getAttribute('href')).toBe(
      '/billing',
    );
    // The button names the notice as its description, for screen readers.
    const describedBy = sendButton().getAttribute('aria-describedby');
    expect(describedBy).toBeTruthy();
    expect(document.getElementById(describedBy!)?.textContent).toContain('are taken');
    fireEvent.change(screen.getByLabelText('Email'), { target: { value: 'ash@studio.test' } });
    fireEvent.click(sendButton());
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(posts).toEqual([]);
  });

  it('tells an admin, who cannot open Billing, that an owner changes the plan', async () => {
    const admin = {
      ...demoSession,
      role: 'admin' as const,
      permissions: demoSession.permissions.filter((p) => p !== 'billing:manage'),
    };
    stubApi(
      async (path) => {
        if (path === '/v1/team/members')
          return jsonResponse({ data: [owner], seats: seats(2, 2, 0, 'Free') });
        if (path === '/v1/team/invites') return jsonResponse({ data: [] });
        return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
      },
      undefined,
      admin,
    );
    renderApp('/team');
    const reason = await screen.findByText('All 2 seats of the Free plan are taken.');
    const notice = reason.closest('[role="status"]') as HTMLElement;
    expect(notice.textContent).toContain('An owner can change the plan on the Billing page.');
    expect(within(notice).queryByRole('link')).toBeNull();
  });

  it('says how far over the seats the team is after a move to a smaller plan', async () => {
    stub({ seats: seats(2, 4, 0, 'Free') });
    renderApp('/team');
    const reason = await screen.findByText(
      'Your studio has 4 members, more than the 2 seats of the Free plan.',
    );
    const notice = reason.closest('[role="status"]') as HTMLElement;
    expect(notice.textContent).toContain(
      'Everyone keeps access, but nobody new can join until 3 members are removed',
    );
    expect((sendButton() as HTMLButtonElement).disabled).toBe(true);
  });

  it('shows the server’s problem detail when an invitation is refused, and refreshes the seats', async () => {
    const state = { seats: seats(2, 1, 0, 'Free') };
    const { mock, posts } = stub(state, () => {
      // Someone else took the last seat meanwhile.
      state.seats = seats(2, 1, 1, 'Free');
      return jsonResponse(refusal, 409, 'application/problem+json');
    });
    renderApp('/team');
    await screen.findByText('1 of 2 seats used');
    fireEvent.change(screen.getByLabelText('Email'), { target: { value: 'ash@studio.test' } });
    fireEvent.click(sendButton());
    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toBe(refusal.detail);
    expect(posts).toHaveLength(1);
    // The role left as it opened: photographer, never the first option (owner).
    expect(posts[0]).toMatchObject({ email: 'ash@studio.test', role: 'photographer' });
    await screen.findByText('2 of 2 seats used');
    await waitFor(() => expect((sendButton() as HTMLButtonElement).disabled).toBe(true));
    const memberCalls = mock.mock.calls.filter(([input]) =>
      String(input instanceof Request ? input.url : input).endsWith('/v1/team/members'),
    );
    expect(memberCalls.length).toBeGreaterThanOrEqual(2);
  });
});

describe('team page members', () => {
  const admin = {
    userId: 'u-admin',
    name: 'Demo Admin',
    email: 'admin@studio.test',
    role: 'admin',
    joinedAt: '2026-02-01T00:00:00Z',
  };
  const shooter = {
    userId: 'u-shooter',
    name: 'Demo Shooter',
    email: 'shooter@studio.test',
    role: 'photographer',
    joinedAt: '2026-03-01T00:00:00Z',
  };

  function stubMembers(session: typeof demoSession) {
    const patches: { path: string; body: unknown }[] = [];
    const mock = stubApi(
      async (path, _init, request) => {
        if (path.startsWith('/v1/team/members/') && request.method === 'PATCH') {
          patches.push({ path, body: await request.clone().json() });
          return jsonResponse({ ...shooter, role: 'admin' });
        }
        if (path === '/v1/team/members')
          return jsonResponse({ data: [owner, admin, shooter], seats: seats(10, 3, 0) });
        if (path === '/v1/team/invites') return jsonResponse({ data: [] });
        return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
      },
      undefined,
      session,
    );
    return { mock, patches };
  }

  it('asks before changing a role, and changes nothing when the question is cancelled', async () => {
    const { patches } = stubMembers(demoSession);
    renderApp('/team');
    const select = await screen.findByLabelText('Role of Demo Shooter');
    fireEvent.change(select, { target: { value: 'admin' } });
    let dialog = await screen.findByRole('dialog');
    expect(within(dialog).getByText('Make Demo Shooter an admin?')).toBeTruthy();
    expect(dialog.textContent).toContain('From photographer to admin');
    fireEvent.click(within(dialog).getByRole('button', { name: 'Cancel' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    expect(patches).toHaveLength(0);
    expect((screen.getByLabelText('Role of Demo Shooter') as HTMLSelectElement).value).toBe(
      'photographer',
    );

    fireEvent.change(screen.getByLabelText('Role of Demo Shooter'), {
      target: { value: 'admin' },
    });
    dialog = await screen.findByRole('dialog');
    fireEvent.click(within(dialog).getByRole('button', { name: 'Change role' }));
    await waitFor(() => expect(patches).toHaveLength(1));
    expect(patches[0]).toEqual({ path: '/v1/team/members/u-shooter', body: { role: 'admin' } });
  });

  /** The members table's row that names `name`. */
  const rowOf = (name: string) =>
    screen.getAllByRole('row').find((r) => within(r).queryByText(name) !== null)!;

  it('shows an admin their own role as text, saying who can change it', async () => {
    const { patches } = stubMembers({
      ...demoSession,
      role: 'admin',
      user: { ...demoSession.user, id: 'u-admin' },
    });
    renderApp('/team');
    await screen.findByLabelText('Role of Demo Shooter');
    expect(screen.queryByLabelText('Role of Demo Admin')).toBeNull();
    const mine = rowOf('Demo Admin');
    expect(within(mine).queryByRole('combobox')).toBeNull();
    expect(within(mine).getByText('admin')).toBeTruthy();
    expect(within(mine).getByText('Another admin or an owner can change your role.')).toBeTruthy();
    expect(within(mine).queryByRole('link')).toBeNull();
    // Other people's roles stay editable, and their rows carry no such hint.
    expect(within(rowOf('Demo Shooter')).getByRole('combobox')).toBeTruthy();
    expect(screen.getAllByText(/can change your role/)).toHaveLength(1);
    expect(patches).toHaveLength(0);
  });

  it('points an owner at Transfer ownership on the Studio page instead of a role control', async () => {
    stubMembers(demoSession);
    renderApp('/team');
    await screen.findByLabelText('Role of Demo Shooter');
    expect(screen.queryByLabelText('Role of Demo Owner')).toBeNull();
    const mine = rowOf('Demo Owner');
    expect(within(mine).queryByRole('combobox')).toBeNull();
    expect(within(mine).getByText('owner')).toBeTruthy();
    expect(mine.textContent).toContain(
      'Another owner can change your role, or you can hand the studio over with Transfer ownership on the Studio page.',
    );
    expect(
      within(mine).getByRole('link', { name: 'Transfer ownership' }).getAttribute('href'),
    ).toBe('/studio');
    expect(screen.getByLabelText('Role of Demo Admin')).toBeTruthy();
  });

  it('offers an admin no way to change or remove the owner', async () => {
    stubMembers({ ...demoSession, role: 'admin', user: { ...demoSession.user, id: 'u-admin' } });
    renderApp('/team');
    await screen.findByLabelText('Role of Demo Shooter');
    expect(screen.queryByLabelText('Role of Demo Owner')).toBeNull();
    expect(screen.queryByRole('button', { name: 'Remove Demo Owner' })).toBeNull();
    expect(screen.getByRole('button', { name: 'Remove Demo Shooter' })).toBeTruthy();
  });
});
