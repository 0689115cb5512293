import { describe, expect, it } from 'vitest';
import { parseStudyInput, StudyInputError } from '#shared/schemas/study-input';
import { exhaustOf, exhaustStudy } from '../exhaust/fixtures';

const issuesOf = (input: unknown): string[] => {
  try {
    parseStudyInput(input);
    return [];
  } catch (err) {
    if (!(err instanceof StudyInputError)) throw err;
    return err.issues.map((i) => `${i.path}: ${i.message}`);
  }
};

describe('the exhaust block of a Plan', () => {
  it('is optional, and a valid one passes', () => {
    expect(issuesOf(exhaustStudy([exhaustOf()]))).toEqual([]);
    const without = exhaustStudy([exhaustOf()]);
    delete without.plans[0].exhaust;
    expect(issuesOf(without)).toEqual([]);
  });

  it('refuses unit slips and impossible values by field path', () => {
    const bad = (change: Record<string, unknown>) => issuesOf(exhaustStudy([{ ...exhaustOf(), ...change } as never]));
    expect(bad({ wastegates: { count: 1, valveDiameter: 44, dischargeCoefficient: 0.8 } })[0]).toMatch(
      /^plans\.0\.exhaust\.wastegates\.valveDiameter: .*44 mm = 0\.044 m/,
    );
    expect(bad({ wastegates: { count: 3, valveDiameter: 0.04, dischargeCoefficient: 0.8 } })[0]).toMatch(/^plans\.0\.exhaust\.wastegates\.count: /);
    expect(
      bad({
        turbineInletTemperature: [
          { rpm: 3000, value: 850 },
          { rpm: 2000, value: 900 },
        ],
      })[0],
    ).toMatch(/increasing rpm/);
    expect(bad({ turbineInletTemperature: [{ rpm: 3000, value: 250 }] })[0]).toMatch(/turbineInletTemperature\.0\.value: .*K/);
    expect(bad({ mechanicalEfficiency: 95 })[0]).toMatch(/^plans\.0\.exhaust\.mechanicalEfficiency: .*not a percentage/);
    expect(bad({ pulseFactor: 1.2 })[0]).toMatch(/^plans\.0\.exhaust\.pulseFactor: the pulse factor applies only to a divided housing/);
    expect(bad({ housing: 'twin' })[0]).toMatch(/housing must be single or divided/);
    expect(bad({ backPressure: 1 })[0]).toMatch(/backPressure/); // strict: an unknown key is named
    expect(issuesOf(exhaustStudy([exhaustOf({ housing: 'divided', pulseFactor: 1.2 })]))).toEqual([]);
  });
});
