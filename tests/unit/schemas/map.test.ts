import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { mapMetadataSchema, mapMetadataUpdateSchema, mapNameSchema, spoolbookMapSchema } from '#shared/schemas/map';
import { compressorOf, demoMapFiles, demoMapsFolder, goodFixtures, parseOk, readBytes, turbineOf } from '../maps/helpers';

describe('map schemas', () => {
  it('accepts every parsed demo map as stored JSON, unchanged', () => {
    for (const file of demoMapFiles()) {
      const map = parseOk(readFileSync(path.join(demoMapsFolder, file), 'utf8'));
      const json = JSON.parse(JSON.stringify(map));
      expect(spoolbookMapSchema.parse(json)).toEqual(map);
    }
  });

  it('refuses map JSON that the model could not trust, naming the field', () => {
    const map = compressorOf(parseOk(readBytes(path.join(goodFixtures, 'compressor-minimal.csv'))));
    const badEfficiency = structuredClone(map);
    badEfficiency.curves[2].points[0].efficiency = 65; // percent slipped into the SI model
    const result = spoolbookMapSchema.safeParse(badEfficiency);
    expect(result.success).toBe(false);
    expect(result.error?.issues[0].path).toEqual(['curves', 2, 'points', 0, 'efficiency']);

    const notFinite = JSON.parse(JSON.stringify(map).replace('"pressureRatio":1.2', '"pressureRatio":null'));
    expect(spoolbookMapSchema.safeParse(notFinite).success).toBe(false);

    const noSurge = { ...map, curves: map.curves.filter((c) => c.kind !== 'surge') };
    expect(spoolbookMapSchema.safeParse(noSurge).error?.issues.map((i) => i.message)).toContain('needs exactly one surge line (found 0)');

    const wrongUnit = { ...map, fileUnits: { ...map.fileUnits, flowUnit: 'kPa' } };
    expect(spoolbookMapSchema.safeParse(wrongUnit).error?.issues[0].path).toEqual(['fileUnits', 'flowUnit']);

    expect(spoolbookMapSchema.safeParse({ ...map, extra: 1 }).success).toBe(false);
  });

  it('ties scroll feed to a divided housing', () => {
    const turbine = turbineOf(parseOk(readBytes(path.join(goodFixtures, 'turbine-divided.csv'))));
    expect(spoolbookMapSchema.safeParse(turbine).success).toBe(true);
    expect(spoolbookMapSchema.safeParse({ ...turbine, housing: 'single' }).success).toBe(false);
    expect(spoolbookMapSchema.safeParse({ ...turbine, scrollFeed: null }).success).toBe(false);
  });

  it('checks names and notes the API accepts', () => {
    expect(mapNameSchema.parse('  Street build S44  ')).toBe('Street build S44');
    expect(mapNameSchema.safeParse('=SUM(A1)').success).toBe(false);
    expect(mapNameSchema.safeParse('-5 trim').success).toBe(false);
    expect(mapNameSchema.safeParse('').success).toBe(false);
    expect(mapNameSchema.safeParse('x'.repeat(121)).success).toBe(false); // MAX_MAP_NAME_LENGTH is 120
    expect(mapNameSchema.safeParse('two\nlines').success).toBe(false);
    expect(mapMetadataSchema.safeParse({ name: 'A', notes: 'line one\nline two' }).success).toBe(true);
    expect(mapMetadataSchema.safeParse({ name: 'A', notes: 'x'.repeat(5001) }).success).toBe(false); // MAX_NOTES_LENGTH is 5000
    expect(mapMetadataUpdateSchema.safeParse({}).success).toBe(false);
    expect(mapMetadataUpdateSchema.safeParse({ notes: '' }).success).toBe(true);
  });
});
