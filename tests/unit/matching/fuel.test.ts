import { describe, expect, it } from 'vitest';
import { runStudy } from '#shared/matching/run-study';
import { parseStudyInput } from '#shared/schemas/study-input';
import { expectClose } from '../expect-close';
import { baseStudy, computeAt, solved } from './fixtures';

describe('brake power from whichever of air and fuel runs out first', () => {
  // ṁ_air = VE·ρ_man·V_d·N/(60·n_R) with ρ_man = 200000/(287.05287·320) = 2.17727 kg/m³:
  // 0.9·2.17727·0.002·6000/120 = 0.195955 kg/s (Heywood 1988, §2.10; worked by hand).
  const air = 0.9 * (200_000 / (287.05287 * 320)) * 0.002 * (6000 / 120);

  it('rich or stoichiometric: the air sets it, P = η_b·LHV·ṁ_air/AFR_s', () => {
    // Heywood 1988, eq. 2.23 (η_f = P/(ṁ_f·Q_LHV)) with only the fuel that finds air burning; petrol
    // AFR_s 14.7 and LHV 44 MJ/kg (Heywood App. D). 0.3·44e6·0.195955/14.7 = 175 960 W (worked by hand).
    expectClose(computeAt(0.8).brakePower!, (0.3 * 44e6 * air) / 14.7, 1e-9);
    expectClose(computeAt(1.0).brakePower!, (0.3 * 44e6 * air) / 14.7, 1e-9);
  });

  it('lean: only the fuel supplied burns, P = η_b·LHV·ṁ_fuel, so power falls as 1/λ', () => {
    // ṁ_fuel = ṁ_air/(λ·AFR_s) (definition of λ); same eq. 2.23. λ 1.2: 146 633 W; λ 2.0: 87 980 W (worked by hand).
    expectClose(computeAt(1.2).brakePower!, (0.3 * 44e6 * air) / (1.2 * 14.7), 1e-9);
    expectClose(computeAt(2.0).brakePower!, (0.3 * 44e6 * air) / (2.0 * 14.7), 1e-9);
    expect(computeAt(1.2).brakePower!).toBeLessThan(computeAt(0.8).brakePower!);
  });

  it('says in the Working which of the two sets the power', () => {
    const study = baseStudy();
    study.fuelSystem.lambda = [{ rpm: 2000, value: 1.1 }];
    const v = solved(runStudy(parseStudyInput(study)).lines[0].points[2]);
    expect(v.powerLimitedBy).toBe('fuel');
    study.fuelSystem.lambda = [{ rpm: 2000, value: 0.85 }];
    expect(solved(runStudy(parseStudyInput(study)).lines[0].points[2]).powerLimitedBy).toBe('air');
  });
});
