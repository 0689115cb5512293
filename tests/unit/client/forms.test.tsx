import { describe, expect, it } from 'vitest';
import { signUpSchema } from '#shared/schemas/account';
import { ApiError } from '#src/lib/api-client';
import { asSentence, formErrorsFrom, parseForm } from '#src/lib/forms';

describe('form errors from the server', () => {
  it('puts known paths beside their fields and the rest in the general message', () => {
    const error = new ApiError({
      status: 400,
      code: 'invalid_input',
      message: 'Invalid request body',
      fieldErrors: { email: 'must be an e-mail address', extra: 'unrecognized key' },
    });
    const errors = formErrorsFrom(error, ['email', 'password']);
    expect(errors.fields).toEqual({ email: 'Must be an e-mail address.' });
    expect(errors.form).toBe('Extra: unrecognized key.');
  });

  it('uses the server message as the general message when no field is named', () => {
    const error = new ApiError({ status: 409, code: 'last_owner', message: 'A team needs at least one owner.' });
    expect(formErrorsFrom(error, ['role'])).toEqual({ form: 'A team needs at least one owner.', fields: {} });
  });

  it('reads the shared schema messages as sentences', () => {
    expect(asSentence('must be at least 8 characters')).toBe('Must be at least 8 characters.');
    expect(asSentence('Already a sentence.')).toBe('Already a sentence.');
  });
});

describe('form validation with the shared schemas', () => {
  it('reports each bad field once, worded as the server would', () => {
    const result = parseForm(signUpSchema, { name: '', email: 'not-an-address', password: 'short' }, ['name', 'email', 'password']);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.errors.fields).toEqual({
      name: 'Is required.',
      email: 'Must be an e-mail address.',
      password: 'Must be at least 8 characters.',
    });
    expect(result.errors.form).toBeNull();
  });

  it('passes valid input through the schema (trimmed and lower-cased e-mail)', () => {
    const result = parseForm(signUpSchema, { name: ' Ada ', email: ' Ada@Example.TEST ', password: 'long enough phrase' });
    expect(result).toEqual({ ok: true, data: { name: 'Ada', email: 'ada@example.test', password: 'long enough phrase' } });
  });
});
