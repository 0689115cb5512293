import type { z } from 'zod';
import { isApiError } from './api-client';
import { issuePath } from '#shared/schemas/issue-path';

/** What a form shows: a general message above it and messages beside named fields. */
export interface FormErrors {
  form: string | null;
  fields: Record<string, string>;
}

export const noFormErrors: FormErrors = { form: null, fields: {} };

/**
 * The shared schemas word their messages to follow the field's name ("must be at least 8
 * characters"); beside a labelled field they read better as a sentence.
 */
export function asSentence(message: string): string {
  const trimmed = message.trim();
  if (trimmed.length === 0) return trimmed;
  const capitalised = trimmed[0].toUpperCase() + trimmed.slice(1);
  return /[.!?]$/.test(capitalised) ? capitalised : `${capitalised}.`;
}

/**
 * Splits an error into messages beside the form's own fields and a general message for the
 * rest (unknown paths, conflicts, network trouble), so nothing the server says is dropped.
 */
export function formErrorsFrom(error: unknown, fieldNames: readonly string[]): FormErrors {
  if (!error) return noFormErrors;
  if (!isApiError(error)) {
    return { form: 'Something went wrong. Try again.', fields: {} };
  }
  const fields: Record<string, string> = {};
  const others: string[] = [];
  for (const [path, message] of Object.entries(error.fieldErrors)) {
    if (fieldNames.includes(path)) fields[path] = asSentence(message);
    else others.push(path === '(body)' ? asSentence(message) : `${path}: ${message}`);
  }
  if (Object.keys(fields).length > 0) {
    return { form: others.length > 0 ? others.map(asSentence).join(' ') : null, fields };
  }
  return { form: others.length > 0 ? `${error.message} (${others.join('; ')})` : error.message, fields };
}

/** Validates form values with a shared request schema, giving errors in the same shape as the server's. */
export function parseForm<S extends z.ZodType>(
  schema: S,
  values: unknown,
  /** The form's own fields; issues on other paths go to the general message. All paths when omitted. */
  fieldNames?: readonly string[],
): { ok: true; data: z.output<S> } | { ok: false; errors: FormErrors } {
  const result = schema.safeParse(values);
  if (result.success) return { ok: true, data: result.data };
  const fields: Record<string, string> = {};
  const general: string[] = [];
  for (const issue of result.error.issues) {
    const path = issuePath(issue.path);
    const shownBesideField = path !== '' && (fieldNames === undefined || fieldNames.includes(path));
    if (!shownBesideField) general.push(asSentence(path === '' ? issue.message : `${path}: ${issue.message}`));
    else if (!(path in fields)) fields[path] = asSentence(issue.message);
  }
  return { ok: false, errors: { form: general.length > 0 ? general.join(' ') : null, fields } };
}

/** The text inputs of a submitted form as a plain object (files and repeated names are not used here). */
export function formValues(form: HTMLFormElement): Record<string, string> {
  const values: Record<string, string> = {};
  for (const [name, value] of new FormData(form)) {
    if (typeof value === 'string') values[name] = value;
  }
  return values;
}
