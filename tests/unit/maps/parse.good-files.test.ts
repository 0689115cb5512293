import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseMapFile } from '#shared/maps';
import { compressorOf, goodFixtures, parseOk, readBytes, turbineOf } from './helpers';
import { expectClose } from '../expect-close';

const minimal = compressorOf(parseOk(readBytes(path.join(goodFixtures, 'compressor-minimal.csv'))));

/** The same map under another name: what a file saved differently must give. */
function sameMapBut(name: string) {
  return { ...minimal, name };
}

describe('good map files', () => {
  it('reads the minimal compressor file into SI', () => {
    expect(minimal.reference).toEqual({ temperature: 298, pressure: 100_000 }); // 298 K, 100 kPa as written
    expect(minimal.maxSpeed).toBe(150_000); // "# max speed: 150000 rpm" in the fixture
    // the fixture's lines and their row counts, in file order
    expect(minimal.curves.map((c) => `${c.kind}:${c.label}:${c.points.length}`)).toEqual([
      'surge::3',
      'choke::3',
      'speed:80000:3',
      'speed:120000:3',
      'speed:150000:3',
      'island:74:4',
    ]);
    const first = minimal.curves[2].points[0];
    expect(first).toEqual({ correctedMassFlow: 0.05, pressureRatio: 1.2, efficiency: 0.65, speed: 80_000 }); // row "speed,80000,0.05,1.20,65,80000"; 65 % = 0.65
    expect(minimal.fileUnits).toEqual({
      flowAxis: 'corrected-mass',
      flowUnit: 'kg/s',
      referenceTemperatureUnit: 'K',
      referencePressureUnit: 'kPa',
      efficiency: 'percent',
      speedUnit: 'rpm',
      maxSpeedUnit: 'rpm',
    });
  });

  it('accepts a UTF-8 byte-order mark', () => {
    const bytes = readBytes(path.join(goodFixtures, 'with-bom.csv'));
    expect([...bytes.slice(0, 3)]).toEqual([0xef, 0xbb, 0xbf]); // the fixture really starts with the UTF-8 BOM
    expect(parseOk(bytes)).toEqual(sameMapBut('Fixture compressor with a byte-order mark'));
    // The same file handed over as text (a browser's FileReader keeps the BOM as U+FEFF).
    expect(parseOk(new TextDecoder('utf-8', { ignoreBOM: true }).decode(bytes))).toEqual(sameMapBut('Fixture compressor with a byte-order mark'));
  });

  it('accepts Windows line endings', () => {
    const bytes = readBytes(path.join(goodFixtures, 'windows-line-endings.csv'));
    const text = new TextDecoder().decode(bytes);
    expect(text.split('\r\n').length).toBe(29); // the fixture's 28 lines, each ended by CRLF
    expect(text.replace(/\r\n/g, '')).not.toContain('\n');
    expect(parseOk(bytes)).toEqual(sameMapBut('Fixture compressor with Windows line endings'));
  });

  it('reads a file a spreadsheet saved: padded header lines, a quoted note, capitalised column names, empty rows', () => {
    const map = parseOk(readBytes(path.join(goodFixtures, 'spreadsheet-saved.csv')));
    expect(map.notes).toEqual(['measured at 25 degC, dry air']);
    expect({ ...map, notes: [] }).toEqual({ ...sameMapBut('Fixture compressor saved by a spreadsheet'), notes: [] });
  });

  it('reads a divided turbine housing given per scroll', () => {
    const map = turbineOf(parseOk(readBytes(path.join(goodFixtures, 'turbine-divided.csv'))));
    expect(map.housing).toBe('divided');
    expect(map.scrollFeed).toBe('per-scroll');
    expect(map.areaRatio).toBe(0.82); // "# a/r: 0.82" in the fixture
    expect(map.curves).toHaveLength(2); // the fixture's 80000 and 120000 rpm lines
    // 0.0195 kg/s·K^0.5/kPa = 1.95e-5 kg·K^0.5/(s·Pa): 1 kPa = 1000 Pa (SI definition)
    expectClose(map.curves[0].points[0].flowParameter, 1.95e-5, 1e-12);
    expect(map.curves[0].points[0].expansionRatio).toBe(1.4); // the fixture's first row
  });

  it('converts a volume-flow map to corrected mass flow with the reference density', () => {
    const text = new TextDecoder()
      .decode(readBytes(path.join(goodFixtures, 'compressor-minimal.csv')))
      .replace('# flow: corrected mass, kg/s', '# flow: volume, m3/s');
    const map = compressorOf(parseOk(text));
    // ρ_ref = p/(R·T) = 100000/(287.05287·298) = 1.169020 kg/m³ (ideal gas, R of dry air from ISO 2533; by hand)
    expectClose(map.curves[2].points[0].correctedMassFlow, 0.05 * 1.16902, 1e-6);
    expect(map.fileUnits.flowAxis).toBe('volume');
  });

  it('reads numbers with signs and exponents, and units written with degree signs', () => {
    const text = new TextDecoder()
      .decode(readBytes(path.join(goodFixtures, 'compressor-minimal.csv')))
      .replace('# reference temperature: 298 K', '# reference temperature: 24.85 °C')
      .replace('speed,80000,0.05,1.20,65,80000', 'speed,80000,5e-2,+1.20,65,8.0E4');
    const map = compressorOf(parseOk(text));
    expectClose(map.reference.temperature, 298, 1e-12); // 24.85 °C + 273.15 = 298 K (definition of the Celsius scale)
    expect(map.curves[2].points[0]).toEqual({ correctedMassFlow: 0.05, pressureRatio: 1.2, efficiency: 0.65, speed: 80_000 });
  });

  it('never throws, whatever it is given', () => {
    const inputs: Array<string | Uint8Array> = [
      '',
      '#',
      '# :',
      ',,,,',
      '"',
      '\uFEFF',
      'curve,label\n',
      new Uint8Array([0xc3, 0x28]),
      '# spoolbook-map: 1\n# kind: turbine\ncurve,label,expansion_ratio,flow_parameter,efficiency,speed\nflow,a,1e400,1,,\n',
    ];
    for (const input of inputs) {
      const result = parseMapFile(input);
      expect(result.ok).toBe(false);
      if (!result.ok) expect(result.problems.length).toBeGreaterThan(0);
    }
  });
});
