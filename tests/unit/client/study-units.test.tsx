import { describe, expect, it } from 'vitest';
import { formatStudyValue, inputText, parseTypedNumber, quantityUnit } from '#src/lib/quantities';

const close = (actual: number, expected: number, rel = 1e-9) => expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThan(rel);

describe('study quantities in both unit systems', () => {
  it('converts pressures by the psi, gauge or absolute alike', () => {
    close(quantityUnit('pressure', 'us').toSI(1), 6894.757293168361); // 1 psi = 6894.757 Pa (NIST SP 811, App. B.8)
    close(quantityUnit('pressureGauge', 'si').toSI(140), 140_000); // kPa, definition
    expect(quantityUnit('pressureGauge', 'us').label).toBe('psi gauge');
  });

  it('converts a temperature with its offset but a temperature difference by factor only', () => {
    close(quantityUnit('temperature', 'us').toSI(68), 293.15); // 68 °F = 20 °C (NIST SP 811, App. B.8, t/°C = (t/°F − 32)/1.8)
    close(quantityUnit('temperatureDifference', 'us').toSI(9), 5); // a 9 °F rise is a 5 K rise (1 K = 1.8 °F difference; NIST SP 811)
    close(quantityUnit('temperatureDifference', 'si').fromSI(5), 5); // K to K
  });

  it('shows injector flow in cc/min in both systems and fuel flow in L/h or US gal/h', () => {
    close(quantityUnit('injectorFlow', 'us').fromSI(1.6667e-5), 1000.02); // 1 cc/min = 1e-6/60 m³/s, definition
    close(quantityUnit('fuelFlow', 'si').fromSI(1e-3 / 3600), 1); // 1 L/h, definition
    close(quantityUnit('fuelFlow', 'us').toSI(1), 3.785411784e-3 / 3600); // US gallon = 3.785411784 L (NIST SP 811, App. B.8)
  });

  it('converts displacement to cubic inches and altitude to feet', () => {
    close(quantityUnit('volume', 'us').fromSI(0.001998), 121.92544, 1e-6); // 1 in³ = 16.387064 cm³ exactly (NIST SP 811)
    close(quantityUnit('length', 'us').toSI(1000), 304.8); // 1 ft = 0.3048 m exactly (NIST SP 811)
  });

  it('converts BSFC between g/kWh and lb/(hp·h)', () => {
    const bsfc = quantityUnit('bsfc', 'si').toSI(250); // 250 g/kWh
    close(bsfc, 250e-3 / 3.6e6); // 1 kWh = 3.6e6 J, definition
    // 1 lb/(hp·h) = 453.59237 g / 0.74569987 kWh = 608.277 g/kWh (NIST SP 811 pound and horsepower)
    close(quantityUnit('bsfc', 'us').toSI(1), quantityUnit('bsfc', 'si').toSI(608.2774), 1e-6);
  });

  it('shows fractions in percent and formats values with their unit', () => {
    expect(formatStudyValue(0.85, 'fraction', 'si')).toBe('85 %');
    expect(formatStudyValue(140_000, 'pressureGauge', 'si')).toBe('140 kPa gauge');
    expect(formatStudyValue(7500, 'speed', 'us')).toBe('7,500 rpm');
    expect(formatStudyValue(null, 'pressure', 'si')).toBe('—');
    expect(formatStudyValue('M58 mid wheel', 'text', 'si')).toBe('M58 mid wheel');
  });
});

describe('numbers typed and shown in boxes', () => {
  it('shows 5 significant figures without float noise or grouping', () => {
    expect(inputText(0.1 + 0.2)).toBe('0.3');
    expect(inputText(43.51132)).toBe('43.511');
    expect(inputText(121925.09)).toBe('121930');
    expect(inputText(0)).toBe('0');
  });

  it('reads plain numbers, exponents and a typographic minus', () => {
    expect(parseTypedNumber(' 1.5 ')).toEqual({ ok: true, value: 1.5 });
    expect(parseTypedNumber('2e3')).toEqual({ ok: true, value: 2000 });
    expect(parseTypedNumber('−40')).toEqual({ ok: true, value: -40 });
    expect(parseTypedNumber('.5')).toEqual({ ok: true, value: 0.5 });
  });

  it('refuses a decimal comma, text and half-typed numbers with a message', () => {
    expect(parseTypedNumber('1,5')).toEqual({ ok: false, message: 'Use a point for decimals (1.5, not 1,5).' });
    expect(parseTypedNumber('abc').ok).toBe(false);
    expect(parseTypedNumber('1e').ok).toBe(false);
    expect(parseTypedNumber('').ok).toBe(false);
  });
});
