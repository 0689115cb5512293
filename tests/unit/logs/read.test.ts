import { describe, expect, it } from 'vitest';
import { applyMapping } from '#shared/logs/convert';
import { guessMapping, unitFromText } from '#shared/logs/guess';
import { logMappingSchema } from '#shared/logs/mapping';
import { readLogTable, type LogTable } from '#shared/logs/read';
import { expectClose } from '../expect-close';

function table(text: string): LogTable {
  const result = readLogTable(text);
  if (!result.ok) throw new Error(result.problems[0].message);
  return result.table;
}

describe('reading a logger export', () => {
  it('reads semicolons with a decimal comma, notes above the names and units on their own line', () => {
    const t = table('Logger export\nCar: hill-climb\nTime;RPM;MAP;IAT\ns;rpm;kPa;°C\n0,00;3000;101,3;25,5\n0,05;3100;110,0;25,6\n');
    expect(t.delimiter).toBe(';');
    expect(t.decimalComma).toBe(true);
    expect(t.namesLine).toBe(3);
    expect(t.unitsLine).toBe(4);
    expect(t.names).toEqual(['Time', 'RPM', 'MAP', 'IAT']);
    expect(t.headerUnits).toEqual(['s', 'rpm', 'kPa', '°C']);
    expect(Array.from(t.columns[2])).toEqual([101.3, 110]);
    expect(Array.from(t.rowLines)).toEqual([5, 6]);
  });

  it('reads tabs with units in brackets in the names', () => {
    const t = table('Time (s)\tEngine speed [rpm]\tBoost (psi)\n0.0\t3000\t2.5\n0.1\t3050\t3.0\n');
    expect(t.delimiter).toBe('\t');
    expect(t.headerUnits).toEqual(['s', 'rpm', 'psi']);
    expect(t.columns[2][1]).toBe(3);
  });

  it('points at the line and column of a cell that is not a number', () => {
    const t = table('time,rpm,map\n0,3000,100\n0.1,abc,101\n');
    expect(t.unreadable).toEqual([0, 1, 0]);
    expect(t.problems[0]).toMatchObject({ line: 3, column: 2 });
    expect(Number.isNaN(t.columns[1][1])).toBe(true);
  });
});

describe('guessing the mapping', () => {
  it('reads the units loggers write', () => {
    // The unit names of the mapping are mathjs's (mathjs units, an independent library); "common practice, no source" for the loggers' spellings.
    expect(['kPa', 'psig', '°C', 'deg F', 'lb/min', 'g/s', 'kg/h', 'bar', '%'].map(unitFromText)).toEqual([
      'kPa',
      'psi',
      'degC',
      'degF',
      'lb/min',
      'g/s',
      'kg/h',
      'bar',
      'percent',
    ]);
  });

  it('guesses quantities from names and units from the header or the values', () => {
    const t = table(
      'Time;Engine RPM;MAP;Boost;IAT (°C);Charge temp;MAF (g/s);Throttle;Turbo speed;Lambda\n' +
        '0;3000;101,3;0,2;25;40;60;100;60000;0,85\n0,1;3100;180;1,2;26;41;120;100;90000;0,84\n',
    );
    const guess = guessMapping(t);
    const by = Object.fromEntries(guess.map((g) => [g.column, g]));
    expect(by['Time']).toMatchObject({ quantity: 'time', unit: 's' });
    expect(by['Engine RPM']).toMatchObject({ quantity: 'engineSpeed', unit: 'rpm' });
    // Common practice, no source: a manifold pressure whose middle value lies between 60 and 2000 is kPa, and "MAP" is absolute.
    expect(by['MAP']).toMatchObject({ quantity: 'manifoldPressure', unit: 'kPa', reference: 'absolute' });
    // The second pressure column is not taken twice as manifold pressure.
    expect(by['Boost']).toBeUndefined();
    expect(by['IAT (°C)']).toMatchObject({ quantity: 'inletTemperature', unit: 'degC' });
    expect(by['Charge temp']).toMatchObject({ quantity: 'manifoldTemperature', unit: 'degC' });
    expect(by['MAF (g/s)']).toMatchObject({ quantity: 'massAirFlow', unit: 'g/s' });
    expect(by['Throttle']).toMatchObject({ quantity: 'throttle', unit: 'percent' });
    expect(by['Turbo speed']).toMatchObject({ quantity: 'shaftSpeed', unit: 'rpm' });
    expect(by['Lambda']).toMatchObject({ quantity: 'lambda' });
  });

  it('takes a boost column in psi as gauge', () => {
    const t = table('time,rpm,Boost (psi)\n0,3000,1.5\n0.1,3500,12\n');
    expect(guessMapping(t).find((g) => g.column === 'Boost (psi)')).toMatchObject({ quantity: 'manifoldPressure', unit: 'psi', reference: 'gauge' });
  });
});

describe('mapping to SI', () => {
  const text = 'time,rpm,boost,iat,maf\n0,3000,10,77,30\n0.5,3500,15,86,45\n';
  const mapping = (boostUnit = 'psi', reference: 'gauge' | 'absolute' = 'gauge') =>
    logMappingSchema.parse({
      columns: [
        { column: 'time', quantity: 'time', unit: 's' },
        { column: 'rpm', quantity: 'engineSpeed', unit: 'rpm' },
        { column: 'boost', quantity: 'manifoldPressure', unit: boostUnit, reference },
        { column: 'iat', quantity: 'inletTemperature', unit: 'degF' },
        { column: 'maf', quantity: 'massAirFlow', unit: 'lb/min' },
      ],
      gaugeReference: 100_000,
    });

  it('converts units and lifts gauge pressure by the barometric pressure', () => {
    const result = applyMapping(table(text), mapping());
    if (!result.ok) throw new Error(result.problems[0].message);
    const c = result.log.channels;
    // 10 psi = 68 947.57 Pa (NIST SP 811 App. B.8: 1 psi = 6894.757 Pa), plus the 100 000 Pa reference.
    expectClose(c.manifoldPressure![0], 168_947.57, 1e-7, { what: 'absolute manifold pressure' });
    // 77 °F = 298.15 K (NIST SP 811 §4.2.1.1: T/K = (t/°F + 459.67)/1.8).
    expectClose(c.inletTemperature![0], 298.15, 1e-9, { what: 'inlet temperature' });
    // 30 lb/min = 30·0.45359237/60 kg/s = 0.226796185 kg/s (NIST SP 811 App. B.8: 1 lb = 0.45359237 kg).
    expectClose(c.massAirFlow![0], 0.226796185, 1e-9, { what: 'mass air flow' });
    expect(result.log.duration).toBe(0.5);
  });

  it('refuses a pressure that makes no sense in the unit given, with line, column and the likely unit', () => {
    // 10 psi read as kPa absolute is 10 kPa; 15 read as Pa is 15 Pa, below the 5 kPa floor ("0.1 kPa is no manifold pressure", the issue's own example).
    const result = applyMapping(table(text), mapping('Pa', 'absolute'));
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.problems[0]).toMatchObject({ line: 2, column: 3 });
    expect(result.problems[0].message).toMatch(/outside 5 to 1 000 kPa absolute/);
  });
});
