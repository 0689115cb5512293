import { cleanup, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { TextField } from '#src/components/TextField';

afterEach(cleanup);

describe('TextField', () => {
  it('is labelled and shows its error beside the field, tied to it for assistive technology', () => {
    render(<TextField label="E-mail" name="email" error="Must be an e-mail address." hint="Your sign-in address." />);
    const input = screen.getByLabelText('E-mail');
    expect(input.getAttribute('aria-invalid')).toBe('true');
    const describedBy = (input.getAttribute('aria-describedby') ?? '').split(' ');
    const error = screen.getByText('Must be an e-mail address.');
    const hint = screen.getByText('Your sign-in address.');
    expect(describedBy).toContain(error.closest('p')?.id);
    expect(describedBy).toContain(hint.id);
  });

  it('is not marked invalid without an error', () => {
    render(<TextField label="Team name" name="name" />);
    const input = screen.getByLabelText('Team name');
    expect(input.hasAttribute('aria-invalid')).toBe(false);
    expect(input.hasAttribute('aria-describedby')).toBe(false);
  });
});
