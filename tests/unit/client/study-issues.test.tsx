import { describe, expect, it } from 'vitest';
import { describePath } from '#src/features/studies/lib/describe-path';
import { localizeIssue } from '#src/features/studies/lib/localize-issue';

// The shared schemas word limits in SI for API callers; beside a box that converts units they
// are reworded in the box's unit.

describe('localizeIssue', () => {
  it('drops unit-slip hints and converts the limit to the field’s unit', () => {
    expect(localizeIssue('displacement must be above 0 m³', 'volume', 'si')).toBe('displacement must be above 0 L');
    expect(localizeIssue('displacement is in m³ (2.0 L = 0.002 m³); at most 0.05 m³', 'volume', 'si')).toBe('displacement at most 50 L'); // 0.05 m³ = 50 L, definition
    expect(localizeIssue('displacement is in m³ (2.0 L = 0.002 m³); at most 0.05 m³', 'volume', 'us')).toBe('displacement at most 3,051 ci'); // 1 in³ = 16.387064 cm³ (NIST SP 811)
  });

  it('speaks of percent for fractions', () => {
    expect(localizeIssue('volumetric efficiency is a fraction, at most 2', 'fraction', 'si')).toBe('volumetric efficiency must be at most 200 %');
    expect(localizeIssue('effectiveness is a fraction from 0 to 1 (not a percentage)', 'fraction', 'si')).toBe('effectiveness must be from 0 to 100 %');
    expect(localizeIssue('compressor efficiency is a fraction from 0 to 1 (not a percentage); above 1 is impossible', 'fraction', 'us')).toBe(
      'compressor efficiency must be from 0 to 100 %; above 100 % is impossible',
    );
  });

  it('converts absolute temperatures and pressures', () => {
    expect(localizeIssue('ambient temperature is absolute temperature in K, at least 150 K (was °C given?)', 'temperature', 'si')).toBe(
      'ambient temperature at least -123.1 °C',
    ); // 150 K − 273.15 = −123.15 °C (definition of °C), 4 significant figures
    expect(localizeIssue('boost is gauge pressure in Pa: at most 1 000 000 Pa', 'pressureGauge', 'us')).toBe('boost is gauge pressure at most 145 psi gauge'); // 1 MPa = 145.04 psi (NIST SP 811)
  });

  it('leaves messages without SI amounts alone', () => {
    expect(localizeIssue('cylinders must be a whole number', 'count', 'si')).toBe('cylinders must be a whole number');
    expect(localizeIssue('lambda rows must be in increasing rpm', 'ratio', 'us')).toBe('lambda rows must be in increasing rpm');
  });
});

describe('describePath', () => {
  const draft = {
    engine: {
      volumetricEfficiency: [
        { rpm: 2500, value: 0.9 },
        { rpm: 3500, value: 20 },
      ],
    },
    scenarios: [{ name: 'Hot day', boostSchedule: [{ label: 'Full load', boost: [{ rpm: 3000, value: 1e7 }] }] }],
    plans: [{ name: 'M58 mid wheel' }],
  };
  it('names table rows by their speed and scenarios, boost rows and plans by their names', () => {
    expect(describePath('engine.volumetricEfficiency.1.value', draft)).toBe('Engine › volumetric efficiency at 3500 rpm');
    expect(describePath('scenarios.0.boostSchedule.0.boost.0.value', draft)).toBe('Scenario “Hot day” › boost row “Full load” › boost at 3000 rpm');
    expect(describePath('plans.0.turbochargers', draft)).toBe('Plan “M58 mid wheel” › turbochargers');
    expect(describePath('', draft)).toBe('Study');
  });
});
