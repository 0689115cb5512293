import { describe, expect, it } from 'vitest';
import { computeRequestSchema, studyInputSchema } from '#shared/schemas/compute';
import { baseStudy } from './fixtures';

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

describe('schemas never throw on malformed input', () => {
  const cases: [string, unknown][] = [
    ['study input', baseStudy()],
    [
      'compute request',
      {
        engine: { displacement: 0.002, cylinders: 4, strokes: 4 },
        ambient: { altitude: 500 },
        losses: { inlet: 1000, chargeCooler: 5000 },
        fuel: { kind: 'petrol', lambda: 0.85, bsfc: 8e-8, drivetrainLoss: 0.1 },
        points: [{ rpm: 6000, volumetricEfficiency: 0.9, boost: 100_000, manifoldTemperature: 320 }],
      },
    ],
  ];
  for (const [name, valid] of cases) {
    const schema = name === 'study input' ? studyInputSchema : computeRequestSchema;
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
});
