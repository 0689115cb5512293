import { describe, expect, it } from 'vitest';
import { LOSS_REFERENCE_DENSITY, scaledPressureLoss } from '#shared/physics';
import { expectClose } from '../expect-close';

describe('losses that follow the flow', () => {
  it('scale as the square of the flow over the density, worked by hand', () => {
    // Δp = Δp_ref·(ṁ/ṁ_ref)²·(ρ_ref/ρ): 2.5 kPa at 0.2 kg/s and 1.225 kg/m³ → at 0.1 kg/s and 1.1 kg/m³:
    // 2500 × 0.25 × 1.225/1.1 = 696.02 Pa (by hand; duct flow with a constant loss coefficient).
    expectClose(scaledPressureLoss({ pressureLoss: 2500, referenceMassFlow: 0.2, referenceDensity: 1.225 }, 0.1, 1.1), 696.0227, 1e-6);
    // 12 kPa at 0.25 kg/s and 2.4 kg/m³ → at 0.3 kg/s and 2.0 kg/m³: 12000 × 1.44 × 1.2 = 20 736 Pa (by hand).
    expectClose(scaledPressureLoss({ pressureLoss: 12_000, referenceMassFlow: 0.25, referenceDensity: 2.4 }, 0.3, 2.0), 20_736, 1e-12);
  });

  it('takes standard sea-level air when no density is stated, and holds a loss given without its flow', () => {
    expect(LOSS_REFERENCE_DENSITY).toBe(1.225); // ISO 2533 sea-level density 1.2250 kg/m³
    expectClose(scaledPressureLoss({ pressureLoss: 2000, referenceMassFlow: 0.2 }, 0.2, 1.225), 2000, 1e-12); // at its own flow and density: itself
    expect(scaledPressureLoss({ pressureLoss: 2000 }, 0.05, 3)).toBe(2000); // the older fixed form (design)
  });
});
