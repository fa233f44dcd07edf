import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { demoSession, stubApi } from '@/test/api-stub';
import { renderApp } from '@/test/render';
import { jsonResponse } from '@/test/responses';

const STORAGE_KEY = 'lumenwright.length-unit';

const inFeet = { ...demoSession, preferences: { lengthUnit: 'ft' as const } };

interface Patch {
  body: unknown;
  answer: (response: Response) => void;
}

/** Signed in as `session`; every PATCH /v1/me waits until the test answers it. */
function stubWithPendingPatches(session = inFeet) {
  const patches: Patch[] = [];
  stubApi(
    (path, _init, request) => {
      if (path === '/v1/me' && request.method === 'PATCH') {
        return request.json().then(
          (body: unknown) =>
            new Promise<Response>((answer) => {
              patches.push({ body, answer });
            }),
        );
      }
      return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
    },
    undefined,
    session,
  );
  return patches;
}

async function openFlash() {
  renderApp('/playground?calc=flash');
  return screen.findByRole('tabpanel');
}

// Each option is named by its visible abbreviation, then the word (WCAG 2.1 SC 2.5.3).
const radio = (name: 'Metres' | 'Feet') =>
  screen.getByRole('radio', { name: name === 'Metres' ? 'm (metres)' : 'ft (feet)' });

describe('length unit, signed in', () => {
  it('shows the unit saved on the account, over this browser’s own copy, and copies it here', async () => {
    window.localStorage.setItem(STORAGE_KEY, 'm');
    stubWithPendingPatches();
    const panel = await openFlash();
    await waitFor(() => expect(radio('Feet').getAttribute('aria-checked')).toBe('true'));
    expect(within(panel).getByLabelText('Light to subject (ft)')).toBeTruthy();
    await waitFor(() => expect(window.localStorage.getItem(STORAGE_KEY)).toBe('ft'));
  });

  it('switches at once, sends PATCH /v1/me, and stays switched when the server agrees', async () => {
    const patches = stubWithPendingPatches();
    const panel = await openFlash();
    await waitFor(() => expect(radio('Feet').getAttribute('aria-checked')).toBe('true'));

    fireEvent.click(radio('Metres'));
    // Optimistic: the form shows metres while the save is still on its way.
    await waitFor(() => expect(radio('Metres').getAttribute('aria-checked')).toBe('true'));
    expect(within(panel).getByLabelText('Light to subject (m)')).toBeTruthy();
    expect(window.localStorage.getItem(STORAGE_KEY)).toBe('m');
    await waitFor(() => expect(patches).toHaveLength(1));
    expect(patches[0]!.body).toEqual({ preferences: { lengthUnit: 'm' } });

    patches[0]!.answer(jsonResponse({ ...demoSession, preferences: { lengthUnit: 'm' } }));
    await waitFor(() => expect(patches).toHaveLength(1));
    expect(radio('Metres').getAttribute('aria-checked')).toBe('true');
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('goes back to the saved unit and says so when the server refuses the change', async () => {
    const patches = stubWithPendingPatches();
    const panel = await openFlash();
    await waitFor(() => expect(radio('Feet').getAttribute('aria-checked')).toBe('true'));

    fireEvent.click(radio('Metres'));
    await waitFor(() => expect(patches).toHaveLength(1));
    expect(radio('Metres').getAttribute('aria-checked')).toBe('true');
    patches[0]!.answer(
      jsonResponse(
        {
          title: 'Service Unavailable',
          status: 503,
          detail: 'The database is not answering. Try again shortly.',
        },
        503,
        'application/problem+json',
      ),
    );

    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toBe(
      'Not saved to your account: The database is not answering. Try again shortly.',
    );
    expect(radio('Feet').getAttribute('aria-checked')).toBe('true');
    expect(within(panel).getByLabelText('Light to subject (ft)')).toBeTruthy();
    await waitFor(() => expect(window.localStorage.getItem(STORAGE_KEY)).toBe('ft'));
  });

  it('keeps the last choice when toggled quickly (saves go out in order)', async () => {
    const patches = stubWithPendingPatches();
    await openFlash();
    await waitFor(() => expect(radio('Feet').getAttribute('aria-checked')).toBe('true'));

    fireEvent.click(radio('Metres'));
    await waitFor(() => expect(patches).toHaveLength(1));
    fireEvent.click(radio('Feet'));
    await waitFor(() => expect(radio('Feet').getAttribute('aria-checked')).toBe('true'));
    // The second save waits for the first.
    expect(patches).toHaveLength(1);

    patches[0]!.answer(jsonResponse({ ...demoSession, preferences: { lengthUnit: 'm' } }));
    await waitFor(() => expect(patches).toHaveLength(2));
    expect(patches[1]!.body).toEqual({ preferences: { lengthUnit: 'ft' } });
    // The first answer (metres) must not flip the toggle back while the second is pending.
    expect(radio('Feet').getAttribute('aria-checked')).toBe('true');

    patches[1]!.answer(jsonResponse(inFeet));
    await waitFor(() => expect(window.localStorage.getItem(STORAGE_KEY)).toBe('ft'));
    expect(radio('Feet').getAttribute('aria-checked')).toBe('true');
  });
});
