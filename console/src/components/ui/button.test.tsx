import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { Button } from './button';

const classesOf = (name: string) => screen.getByRole('button', { name }).className.split(/\s+/);

describe('Button sizes', () => {
  // Tailwind resolves two conflicting utilities by stylesheet order, so a size must never ship
  // both the default padding and its own: each button carries exactly one of each.
  it('gives a small button only the small padding and type size', () => {
    render(
      <>
        <Button>Save</Button>
        <Button size="sm">Delete row</Button>
        <Button size="inline">Plan without them</Button>
      </>,
    );
    expect(classesOf('Save')).toEqual(expect.arrayContaining(['px-4', 'py-2', 'text-body']));
    const small = classesOf('Delete row');
    expect(small).toEqual(expect.arrayContaining(['px-2', 'py-1', 'text-small']));
    expect(small).not.toContain('px-4');
    expect(small).not.toContain('py-2');
    expect(small).not.toContain('text-body');
    const inline = classesOf('Plan without them');
    expect(inline).toContain('p-0');
    expect(inline).not.toContain('px-4');
  });
});
