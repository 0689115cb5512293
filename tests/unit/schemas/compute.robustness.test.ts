import { describe } from 'vitest';
import { computeRequestSchema } from '#shared/schemas/compute';
import { itNeverThrows } from '../schema-robustness';

describe('schemas never throw on malformed input', () => {
  itNeverThrows('compute request', computeRequestSchema, {
    engine: { displacement: 0.002, cylinders: 4, strokes: 4 },
    ambient: { altitude: 500 },
    losses: { inlet: 1000, chargeCooler: 5000 },
    fuel: { kind: 'petrol', lambda: 0.85, bsfc: 8e-8, drivetrainLoss: 0.1 },
    points: [{ rpm: 6000, volumetricEfficiency: 0.9, boost: 100_000, manifoldTemperature: 320 }],
  });
});
