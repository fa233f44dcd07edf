import { fireEvent, screen, waitFor } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { stubApi } from '@/test/api-stub';
import { renderApp } from '@/test/render';
import { jsonResponse } from '@/test/responses';

describe('sign-up form', () => {
  it('shows the server’s field errors inline under the matching inputs', async () => {
    const fetchMock = stubApi((path) =>
      path === '/v1/auth/sign-up'
        ? jsonResponse(
            {
              type: 'https://lumenwright.test/problems/invalid-input',
              title: 'Invalid input',
              status: 422,
              errors: [{ field: 'password', reason: 'is one of the most common passwords' }],
            },
            422,
            'application/problem+json',
          )
        : jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json'),
    );
    renderApp('/sign-up');
    fireEvent.change(await screen.findByLabelText('Your name'), {
      target: { value: 'Ines Quarry' },
    });
    fireEvent.change(screen.getByLabelText('Studio name'), { target: { value: 'Lantern Lane' } });
    fireEvent.change(screen.getByLabelText('Email'), { target: { value: 'ines@lantern.test' } });
    fireEvent.change(screen.getByLabelText('Password'), { target: { value: 'photography1' } });
    fireEvent.click(screen.getByRole('button', { name: 'Create account' }));

    const message = await screen.findByText('Is one of the most common passwords');
    const input = screen.getByLabelText('Password');
    expect(input.getAttribute('aria-invalid')).toBe('true');
    expect(input.getAttribute('aria-describedby')).toContain(message.id);
    const call = fetchMock.mock.calls.find(
      ([request]) =>
        request instanceof Request && new URL(request.url).pathname === '/v1/auth/sign-up',
    );
    const request = call![0] as Request;
    expect(request.method).toBe('POST');
    expect(request.credentials).toBe('include');
    expect(await request.clone().json()).toEqual({
      name: 'Ines Quarry',
      organizationName: 'Lantern Lane',
      email: 'ines@lantern.test',
      password: 'photography1',
    });
  });

  it('checks the fields before calling the server', async () => {
    const fetchMock = stubApi();
    renderApp('/sign-up');
    fireEvent.click(await screen.findByRole('button', { name: 'Create account' }));
    expect(await screen.findByText('Use at least 10 characters')).toBeTruthy();
    await waitFor(() => expect(screen.getByText('Enter a valid email address')).toBeTruthy());
    const signUpCalls = fetchMock.mock.calls.filter(
      ([request]) => request instanceof Request && request.url.endsWith('/v1/auth/sign-up'),
    );
    expect(signUpCalls).toHaveLength(0);
  });
});

describe('sign-in form', () => {
  it('puts focus back on the password, selected, after a refused sign-in', async () => {
    stubApi();
    stubApiOverride('/v1/me', () =>
      jsonResponse({ title: 'Unauthorized', status: 401 }, 401, 'application/problem+json'),
    );
    stubApiOverride('/v1/auth/sign-in', () =>
      jsonResponse(
        { title: 'Unauthorized', status: 401, detail: 'Wrong e-mail or password.' },
        401,
        'application/problem+json',
      ),
    );
    renderApp('/sign-in');
    fireEvent.change(await screen.findByLabelText('Email'), {
      target: { value: 'wren@studio.test' },
    });
    const password = screen.getByLabelText('Password') as HTMLInputElement;
    fireEvent.change(password, { target: { value: 'not-the-password' } });
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('Wrong e-mail or password.')).toBeTruthy();
    await waitFor(() => expect(document.activeElement).toBe(password));
    expect(password.selectionStart).toBe(0);
    expect(password.selectionEnd).toBe('not-the-password'.length);
  });
});

describe('session gate', () => {
  it('sends a visitor without a session to sign in, remembering where they were going', async () => {
    stubApi();
    const fetchMock = stubApiWithout401();
    const { router } = renderApp('/keys');
    expect(await screen.findByRole('heading', { level: 1, name: 'Sign in' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(router.state.location.search).toBe('?next=%2Fkeys');
    expect(fetchMock).toHaveBeenCalled();
  });
});

function stubApiWithout401() {
  return stubApiOverride('/v1/me', () =>
    jsonResponse({ title: 'Unauthorized', status: 401 }, 401, 'application/problem+json'),
  );
}

function stubApiOverride(path: string, answer: () => Response) {
  const previous = globalThis.fetch;
  const mock = async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = input instanceof Request ? input.url : String(input);
    if (new URL(url).pathname === path) return answer();
    return previous(input, init);
  };
  const spy = vi.fn(mock);
  vi.stubGlobal('fetch', spy);
  return spy;
}
