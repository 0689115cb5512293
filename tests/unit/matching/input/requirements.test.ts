import { describe, expect, it } from 'vitest';
import { REQUIREMENT_DEFAULTS, resolveRequirements } from '#shared/matching/input/requirements';

describe('required margins', () => {
  it('fills absent requirements with the defaults, and keeps what the study gives', () => {
    expect(resolveRequirements(undefined)).toEqual(REQUIREMENT_DEFAULTS);
    expect(resolveRequirements({ minSurgeMargin: 0.1 })).toEqual({ ...REQUIREMENT_DEFAULTS, minSurgeMargin: 0.1 });
  });
});

describe('the required margins block', () => {
  it('refuses a lambda warning above the limit that will apply, the default one included', async () => {
    const { requirementsSchema } = await import('#shared/matching/input/requirements');
    // The default limit is 1.0 (common practice, no source): a warning at 1.05 would never be reached.
    const alone = requirementsSchema.safeParse({ lambdaWarningUnderBoost: 1.05 });
    expect(alone.success).toBe(false);
    expect(alone.error?.issues[0].path).toEqual(['lambdaWarningUnderBoost']);
    const both = requirementsSchema.safeParse({ lambdaWarningUnderBoost: 1.05, lambdaLimitUnderBoost: 1.1 });
    expect(both.success).toBe(true);
    const limitOnly = requirementsSchema.safeParse({ lambdaLimitUnderBoost: 0.85 }); // below the 0.9 default warning
    expect(limitOnly.success).toBe(false);
    expect(limitOnly.error?.issues[0].path).toEqual(['lambdaLimitUnderBoost']);
  });
});
