import { expect, it } from 'vitest';
import type { z } from 'zod';

/** Every path to a value inside a JSON-like object. */
function pathsOf(value: unknown, path: (string | number)[] = [], out: (string | number)[][] = []): (string | number)[][] {
  if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      const p = [...path, Array.isArray(value) ? Number(k) : k];
      out.push(p);
      pathsOf(v, p, out);
    }
  }
  return out;
}

function edited(root: unknown, path: (string | number)[], edit: 'delete' | unknown): unknown {
  const copy = structuredClone(root) as Record<string | number, unknown>;
  let at = copy;
  for (const key of path.slice(0, -1)) at = at[key] as Record<string | number, unknown>;
  const last = path[path.length - 1];
  if (edit === 'delete') {
    if (Array.isArray(at)) at.splice(Number(last), 1);
    else delete at[last];
  } else at[last] = edit;
  return copy;
}

const wrongValues: unknown[] = ['text', null, [], {}, -1, true];

/** A test that `schema` never throws: deleting or retyping any field of a valid input gives issues with messages, never an exception. */
export function itNeverThrows(name: string, schema: z.ZodType, valid: unknown): void {
  it(`${name}: deleting or retyping any field gives issues, never an exception`, () => {
    expect(schema.safeParse(valid).success).toBe(true);
    let refused = 0;
    for (const path of pathsOf(valid)) {
      for (const edit of ['delete', ...wrongValues]) {
        const input = edited(valid, path, edit);
        let result: ReturnType<typeof schema.safeParse> | undefined;
        expect(() => (result = schema.safeParse(input)), `${path.join('.')} → ${JSON.stringify(edit)}`).not.toThrow();
        if (!result!.success) {
          refused++;
          for (const issue of result!.error.issues) expect(issue.message.length).toBeGreaterThan(0);
        }
      }
    }
    expect(refused).toBeGreaterThan(pathsOf(valid).length); // most edits are refused (some, like deleting an optional field, are fine)
  });
}
