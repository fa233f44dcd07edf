import { describe, expect, it, vi } from 'vitest';
import { ApiProblem } from './api';
import { applyServerErrors, problemMessage } from './form-errors';

const invalid = (errors: { field: string; reason: string }[]) =>
  new ApiProblem(422, {
    type: 'https://lumenwright.test/problems/invalid-input',
    title: 'Invalid input',
    status: 422,
    detail: 'Some fields are invalid',
    errors,
  });

describe('applyServerErrors', () => {
  it('puts each problem+json field error on its form field, capitalised', () => {
    const setError = vi.fn();
    const result = applyServerErrors(
      invalid([
        { field: 'email', reason: 'is already registered' },
        { field: 'password', reason: 'is too common' },
      ]),
      ['email', 'password'],
      setError,
    );
    expect(setError).toHaveBeenCalledWith('email', {
      type: 'server',
      message: 'Is already registered',
    });
    expect(setError).toHaveBeenCalledWith('password', { type: 'server', message: 'Is too common' });
    expect(result).toEqual({ placed: ['email', 'password'], formMessage: null });
  });

  it('renames server fields through the map and keeps unknown ones for the form message', () => {
    const setError = vi.fn();
    const result = applyServerErrors(
      invalid([
        { field: 'organizationName', reason: 'must not be empty' },
        { field: 'inputs.sky', reason: 'must be clear, partly-cloudy or overcast' },
      ]),
      ['studio'],
      setError,
      { organizationName: 'studio' },
    );
    expect(setError).toHaveBeenCalledTimes(1);
    expect(setError).toHaveBeenCalledWith('studio', {
      type: 'server',
      message: 'Must not be empty',
    });
    expect(result.formMessage).toBe('Inputs.sky must be clear, partly-cloudy or overcast');
  });

  it('places array-item errors written as a[1].b on the form path a.1.b', () => {
    const setError = vi.fn();
    const result = applyServerErrors(
      invalid([{ field: 'pieces[1].lossStops', reason: 'must not be less than 0' }]),
      ['pieces.1.lossStops'],
      setError,
    );
    expect(setError).toHaveBeenCalledWith('pieces.1.lossStops', {
      type: 'server',
      message: 'Must not be less than 0',
    });
    expect(result).toEqual({ placed: ['pieces.1.lossStops'], formMessage: null });
  });

  it('falls back to the problem detail when there are no field errors', () => {
    const setError = vi.fn();
    const problem = new ApiProblem(401, {
      title: 'Unauthorized',
      detail: 'Wrong email or password',
    });
    const result = applyServerErrors(problem, ['email'], setError);
    expect(setError).not.toHaveBeenCalled();
    expect(result.formMessage).toBe('Wrong email or password');
  });
});

describe('problemMessage', () => {
  it('explains an unreachable server and a rate limit with its wait', () => {
    expect(problemMessage(new ApiProblem(0, { title: 'API unreachable' }))).toMatch(
      /could not be reached/,
    );
    expect(
      problemMessage(new ApiProblem(429, { title: 'Too Many Requests', retryAfterSeconds: 29.2 })),
    ).toBe('Too many attempts. Try again in 30 s.');
  });

  it('prefers detail, then title, for other problems', () => {
    expect(problemMessage(new ApiProblem(403, { title: 'Forbidden', detail: 'Owners only' }))).toBe(
      'Owners only',
    );
    expect(problemMessage(new ApiProblem(404, { title: 'Not Found' }))).toBe('Not Found');
  });
});
