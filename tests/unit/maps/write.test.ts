import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseMapFile, withMetadata, writeMapFile } from '#shared/maps';
import { demoMaps } from '#scripts/generate-demo-maps';
import { compressorOf, demoMapFiles, demoMapsFolder, goodFixtures, parseOk, readBytes } from './helpers';

describe('round trip: parse → write → parse', () => {
  const files = demoMapFiles();

  it('has the demo maps the issue asks for', () => {
    const maps = files.map((f) => parseOk(readFileSync(path.join(demoMapsFolder, f), 'utf8')));
    const compressors = maps.filter((m) => m.kind === 'compressor');
    const turbines = maps.filter((m) => m.kind === 'turbine');
    expect(compressors.length).toBeGreaterThanOrEqual(4); // three sizes plus one in volume flow
    expect(compressors.filter((m) => m.fileUnits.flowAxis === 'volume')).toHaveLength(1); // one map in volume flow (the maps task)
    expect(compressors.every((m) => m.maxSpeed !== null)).toBe(true);
    // Two A/R sizes, each single and divided per scroll (the maps task), and six more housings for
    // the Candidates view (issue 17): five single-scroll and one divided.
    expect(turbines).toHaveLength(10);
    expect(new Set(turbines.map((t) => t.areaRatio)).size).toBe(7); // A/R 0.48, 0.56, 0.64, 0.72, 0.82, 0.92, 1.06 (the generator's list)
    expect(turbines.filter((t) => t.housing === 'divided' && t.scrollFeed === 'per-scroll')).toHaveLength(3); // one divided file per A/R 0.56, 0.64, 0.82
    expect(compressors.filter((m) => /demo compressor F\d+$/.test(m.name))).toHaveLength(10); // the family of ten sizes (issue 17)
    // Clearly different sizes: the largest top-speed choke flow is well over twice the smallest.
    const chokeFlows = compressors.map((m) => Math.max(...m.curves.filter((c) => c.kind === 'choke')[0].points.map((p) => p.correctedMassFlow)));
    expect(Math.max(...chokeFlows) / Math.min(...chokeFlows)).toBeGreaterThan(2);
    for (const m of maps) expect(m.name.startsWith('Spoolbook demo')).toBe(true);
  });

  for (const file of files) {
    it(`${file}: reads back identical, and is written byte for byte as committed`, () => {
      const text = readFileSync(path.join(demoMapsFolder, file), 'utf8');
      const first = parseOk(text);
      const written = writeMapFile(first);
      expect(parseOk(written)).toEqual(first);
      expect(written).toBe(text);
    });
  }

  it('the committed demo maps are what the generator makes today', () => {
    const generated = demoMaps();
    expect(generated.map((g) => g.file).sort()).toEqual(files);
    for (const { file, map } of generated) {
      expect(writeMapFile(map), `${file} is stale: run npm run maps:generate`).toBe(readFileSync(path.join(demoMapsFolder, file), 'utf8'));
    }
  });

  it('keeps the meaning of files written in other units (BOM, CRLF, padded) when written back', () => {
    for (const file of ['with-bom.csv', 'windows-line-endings.csv', 'spreadsheet-saved.csv', 'turbine-divided.csv']) {
      const map = parseOk(readBytes(path.join(goodFixtures, file)));
      expect(parseOk(writeMapFile(map))).toEqual(map);
    }
  });
});

describe('writing map files', () => {
  const minimal = compressorOf(parseOk(readBytes(path.join(goodFixtures, 'compressor-minimal.csv'))));

  it('writes numbers as plain numbers, in the file units, with the full header', () => {
    const text = writeMapFile(minimal);
    const lines = text.split('\n');
    // the fixture's header, plus the speed unit every written file states
    expect(lines.slice(0, 10)).toEqual([
      '# spoolbook-map: 1',
      '# kind: compressor',
      '# name: Fixture compressor',
      '# flow: corrected mass, kg/s',
      '# reference temperature: 298 K',
      '# reference pressure: 100 kPa',
      '# efficiency: percent',
      '# max speed: 150000 rpm',
      '# speed: rpm',
      'curve,label,flow,pressure_ratio,efficiency,speed',
    ]);
    expect(lines).toContain('speed,80000,0.05,1.2,65,80000'); // the row "speed,80000,0.05,1.20,65,80000" of the fixture
    expect(lines).toContain('surge,,0.05,1.2,,'); // the fixture's "surge,,0.05,1.20,,"
    expect(text).not.toContain('"');
  });

  it('escapes a name that a spreadsheet would run as a formula, and the result reads back', () => {
    // The library lets a user rename a map; the name ends up in the file.
    const renamed = withMetadata(minimal, { name: '=HYPERLINK("http://example.invalid")', notes: 'line one\n@line two' });
    const text = writeMapFile(renamed);
    // The quotes inside make the writer quote the whole line: it stays one spreadsheet cell.
    expect(text).toContain(`"# name: '=HYPERLINK(""http://example.invalid"")"`);
    expect(text).toContain('# note: line one\n# note: @line two\n');
    const back = parseOk(text);
    expect(back.name).toBe(`'=HYPERLINK("http://example.invalid")`);
    expect(back.notes).toEqual(['line one', '@line two']);
  });

  it('quotes a label holding a comma, and reads it back', () => {
    const curves = minimal.curves.map((c) => (c.kind === 'island' ? { ...c, label: 'best, 74 %' } : c));
    const text = writeMapFile({ ...minimal, curves });
    expect(text).toContain('island,"best, 74 %",0.12,1.7,74,');
    expect(parseOk(text)).toEqual({ ...minimal, curves });
  });

  it('writes a map in other units and reads the same SI values back', () => {
    const inPounds = {
      ...minimal,
      fileUnits: { ...minimal.fileUnits, flowUnit: 'lb/min', referenceTemperatureUnit: 'degF', referencePressureUnit: 'psi', efficiency: 'fraction' as const },
    };
    const text = writeMapFile(inPounds);
    // 298 K = 76.73 °F (°F = K·9/5 − 459.67, NIST SP 811 B.9); 100 kPa = 14.5038 psi (1 psi = 6894.757 Pa, NIST SP 811)
    expect(text).toContain('# reference temperature: 76.73 degF');
    expect(text).toMatch(/# reference pressure: 14\.5037\d* psi/);
    const back = compressorOf(parseOk(text));
    expect(back.reference).toEqual(minimal.reference);
    expect(back.curves).toEqual(minimal.curves);
  });

  it('a refused file yields no map', () => {
    const result = parseMapFile('# spoolbook-map: 1\n');
    expect(result.ok).toBe(false);
    expect('map' in result).toBe(false);
  });
});
