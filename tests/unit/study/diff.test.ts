import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { studyDocumentSchema, type StudyDocument } from '#shared/schemas/study';
import { fillItemIds, fillListIds } from '#shared/schemas/item-ids';
import { diffDocuments, kindOfPath } from '#shared/study/diff';
import { readStudyDocument } from '#shared/study/document';

const demoPath = path.resolve(import.meta.dirname, '..', '..', '..', 'data', 'demo', 'hillclimb-study.json');
const demoJson = () => JSON.parse(readFileSync(demoPath, 'utf8')) as StudyDocument;

describe('diffDocuments', () => {
  it('finds nothing between a document and its copy', () => {
    expect(diffDocuments(demoJson(), demoJson())).toEqual([]);
  });

  it('names a changed number by a readable path with its kind, before and after in SI', () => {
    const a = demoJson();
    const b = demoJson();
    b.engine.displacement = 0.0021;
    const changes = diffDocuments(a, b);
    expect(changes).toEqual([
      // demo document values (data/demo/hillclimb-study.json), not physics
      { path: 'Engine › displacement', keys: ['engine', 'displacement'], change: 'changed', before: 0.001998, after: 0.0021, kind: 'volume' },
    ]);
  });

  it('matches rows of a table by rpm, so inserting a row is one addition and not a shift of every row', () => {
    const a = demoJson();
    const b = demoJson();
    // Insert a row at 3000 rpm between 2500 and 3500 (demo rows), and change the one at 4500.
    b.engine.volumetricEfficiency.splice(1, 0, { rpm: 3000, value: 0.93 });
    b.engine.volumetricEfficiency.find((r) => r.rpm === 4500)!.value = 1.05;
    const changes = diffDocuments(a, b);
    expect(changes.map((c) => [c.path, c.change, c.before, c.after, c.kind])).toEqual([
      ['Engine › volumetric efficiency at 3000 rpm', 'added', undefined, 0.93, 'fraction'],
      ['Engine › volumetric efficiency at 4500 rpm', 'changed', 1.01, 1.05, 'fraction'],
    ]);
    // The keys point at the row in the newer document (index 3 after the insertion).
    expect(changes[1].keys).toEqual(['engine', 'volumetricEfficiency', 3, 'value']);
  });

  it('reports a removed table row with its old value', () => {
    const a = demoJson();
    const b = demoJson();
    b.fuelSystem.lambda = b.fuelSystem.lambda.filter((r) => r.rpm !== 4500);
    expect(diffDocuments(a, b).map((c) => [c.path, c.change, c.before, c.after, c.kind])).toEqual([
      ['Fuel system › lambda at 4500 rpm', 'removed', 0.8, undefined, 'ratio'],
    ]);
  });

  it('names scenarios and boost rows by their names, and boost as gauge pressure', () => {
    const a = demoJson();
    const b = demoJson();
    b.scenarios[2].boostSchedule[1].boost[1].value = 110_000;
    b.scenarios[1].ambient = { altitude: 1600, temperature: 308.15 };
    const changes = diffDocuments(a, b);
    expect(changes.map((c) => [c.path, c.before, c.after, c.kind])).toEqual([
      ['Scenario 2 “1,500 m, 35 °C” › ambient › altitude', 1500, 1600, 'length'],
      ['Scenario 3 “Sea level, by gear” › boost row “2nd gear” › boost at 4500 rpm', 100_000, 110_000, 'pressureGauge'],
    ]);
  });

  it('matches plans by id, so reordering them is no change and a rename is one renaming', () => {
    const a = demoJson();
    const b = demoJson();
    b.plans.reverse();
    expect(diffDocuments(a, b)).toEqual([]);
    b.plans[0].name = 'L76 race wheel, ported shroud';
    b.plans[0].maxShaftSpeed = 150_000;
    const changes = diffDocuments(a, b);
    expect(changes.map((c) => [c.path, c.change, c.before, c.after, c.kind])).toEqual([
      ['Plan “L76 race wheel, ported shroud”', 'renamed', 'L76 race wheel', 'L76 race wheel, ported shroud', 'text'],
      ['Plan “L76 race wheel, ported shroud” › max wheel speed', 'added', undefined, 150_000, 'speed'],
    ]);
  });

  it('reports whole plans and scenarios added or removed as objects', () => {
    const a = demoJson();
    const b = demoJson();
    const removed = b.plans.splice(1, 1)[0];
    b.scenarios.push({ ...b.scenarios[0], name: 'Cold morning' });
    const changes = diffDocuments(a, b);
    expect(changes.map((c) => [c.path, c.change, c.kind])).toEqual([
      ['Scenario 5 “Cold morning”', 'added', null],
      ['Plan “M58 mid wheel”', 'removed', null],
    ]);
    expect(changes[1].before).toEqual(removed);
  });

  it('keeps temperature differences apart from temperatures, and follows a switch of the intercooler kind', () => {
    const a = demoJson();
    const b = demoJson();
    b.losses.inletTemperatureRise = 8;
    b.intercooler = { kind: 'fixed', manifoldTemperature: 318.15 };
    const changes = diffDocuments(a, b);
    expect(changes.map((c) => [c.path, c.change, c.before, c.after, c.kind])).toEqual([
      ['Losses › intake heating', 'changed', 5, 8, 'temperatureDifference'],
      ['Intercooler › kind', 'changed', 'effectiveness', 'fixed', 'text'],
      ['Intercooler › effectiveness', 'removed', 0.75, undefined, 'fraction'],
      ['Intercooler › manifold temperature', 'added', undefined, 318.15, 'temperature'],
    ]);
  });

  it('reports a changed rpm list as one change of speeds', () => {
    const a = demoJson();
    const b = demoJson();
    a.engine.rpm = { kind: 'list', values: [3000, 5000] };
    b.engine.rpm = { kind: 'list', values: [3000, 5000, 7000] };
    expect(diffDocuments(a, b)).toEqual([
      {
        path: 'Engine › rpm points › rpm list',
        keys: ['engine', 'rpm', 'values'],
        change: 'changed',
        before: [3000, 5000],
        after: [3000, 5000, 7000],
        kind: 'speed',
      },
    ]);
  });

  it('works on documents that pass the study schema and does not change them', () => {
    const a = studyDocumentSchema.parse(demoJson());
    const b = studyDocumentSchema.parse(demoJson());
    b.fuelSystem.injectors.primary.ratedFlow = 1.8e-5;
    const frozenA = JSON.stringify(a);
    const frozenB = JSON.stringify(b);
    const changes = diffDocuments(a, b);
    expect(changes.map((c) => [c.path, c.kind])).toEqual([['Fuel system › injectors › primary set › rated flow', 'injectorFlow']]);
    expect(JSON.stringify(a)).toBe(frozenA);
    expect(JSON.stringify(b)).toBe(frozenB);
  });
});

describe('diffDocuments by identity of scenarios and boost rows', () => {
  it('reports a duplicated scenario as one added, not as the scenarios after it renamed', () => {
    // The editor holds a stored document as every reader gives it (ids filled), and duplicates
    // with a deep copy (its id too) placed right after the original.
    const a = fillItemIds(demoJson());
    const b = structuredClone(a);
    b.scenarios.splice(1, 0, { ...structuredClone(b.scenarios[0]), name: `${b.scenarios[0].name} (copy)` });
    const changes = diffDocuments(a, b);
    expect(changes.map((c) => [c.path, c.change, c.keys])).toEqual([['Scenario 2 “Sea level, 20 °C (copy)”', 'added', ['scenarios', 1]]]);
  });

  it('reports the same when both documents already carry ids (read back after a save)', () => {
    const a = readStudyDocument(demoJson());
    if (!a.ok) throw new Error(a.message);
    const b = structuredClone(a.document);
    b.scenarios.splice(1, 0, { ...structuredClone(b.scenarios[0]), name: 'Copy' });
    const saved = readStudyDocument(b);
    if (!saved.ok) throw new Error(saved.message);
    expect(diffDocuments(a.document, saved.document).map((c) => [c.path, c.change])).toEqual([['Scenario 2 “Copy”', 'added']]);
  });

  it('reports a removed middle scenario as one removal, and a renamed one as one renaming', () => {
    // Ids as every reader fills them; the edit keeps them, as the editor does.
    const a = fillItemIds(demoJson());
    const b = structuredClone(a);
    const [removed] = b.scenarios.splice(1, 1);
    b.scenarios[1].name = 'Sea level, every gear';
    const changes = diffDocuments(a, b);
    expect(changes.map((c) => [c.path, c.change, c.before, c.after])).toEqual([
      ['Scenario 2 “Sea level, every gear”', 'renamed', 'Sea level, by gear', 'Sea level, every gear'],
      ['Scenario 2 “1,500 m, 35 °C”', 'removed', removed, undefined],
    ]);
  });

  it('matches boost rows by id inside their scenario: a renamed row with a changed boost is a renaming and one change', () => {
    const a = fillItemIds(demoJson());
    const b = structuredClone(a);
    const rows = b.scenarios[2].boostSchedule;
    rows[1].label = 'Second gear';
    rows[1].boost[1].value = 110_000;
    rows.reverse();
    const changes = diffDocuments(a, b);
    expect(changes.map((c) => [c.path, c.change, c.before, c.after, c.kind])).toEqual([
      ['Scenario 3 “Sea level, by gear” › boost row “Second gear”', 'renamed', '2nd gear', 'Second gear', 'text'],
      // demo document value (data/demo/hillclimb-study.json): 100 kPa gauge at 4500 rpm
      ['Scenario 3 “Sea level, by gear” › boost row “Second gear” › boost at 4500 rpm', 'changed', 100_000, 110_000, 'pressureGauge'],
    ]);
    // The keys point at the row where it stands in the newer document.
    expect(changes[1].keys.slice(0, 4)).toEqual(['scenarios', 2, 'boostSchedule', rows.length - 2]);
  });

  it('reports an added boost row once, even when it copies the row before it', () => {
    const a = demoJson();
    const b = demoJson();
    const rows = b.scenarios[0].boostSchedule;
    rows.push({ ...structuredClone(rows[rows.length - 1]), label: 'Row 2' });
    expect(diffDocuments(a, b).map((c) => [c.path, c.change])).toEqual([['Scenario 1 “Sea level, 20 °C” › boost row “Row 2”', 'added']]);
  });
});

describe('fillItemIds', () => {
  it('gives every scenario and boost row of a document without ids an id by position, the same on every read', () => {
    const doc = fillItemIds(demoJson());
    expect(doc.scenarios.map((s) => s.id)).toEqual(doc.scenarios.map((_s, i) => `scenario-${i + 1}`));
    expect(doc.scenarios[2].boostSchedule.map((r) => r.id)).toEqual(doc.scenarios[2].boostSchedule.map((_r, i) => `row-${i + 1}`));
    expect(fillItemIds(demoJson())).toEqual(doc);
    // A document whose ids are all present and distinct comes back as it was.
    expect(fillItemIds(doc)).toBe(doc);
  });

  it('keeps the first of two items sharing an id and gives the copy the first free one', () => {
    const list = fillListIds([{ id: 'a' }, { id: 'a' }, {}, { id: 'row-2' }], 'row');
    expect(list).toEqual([{ id: 'a' }, { id: 'row-3' }, { id: 'row-4' }, { id: 'row-2' }]);
  });

  it('keeps saved documents valid: the filled document passes the study schema and keeps its ids', () => {
    const read = readStudyDocument(demoJson());
    if (!read.ok) throw new Error(read.message);
    expect(read.document.scenarios[0].id).toBe('scenario-1');
    expect(read.document.scenarios[0].boostSchedule[0].id).toBe('row-1');
  });

  it('replaces an id that is not short text, so a stored document never fails on its ids', () => {
    const doc = demoJson() as unknown as { scenarios: { id: unknown }[] };
    doc.scenarios[0].id = 7;
    doc.scenarios[1].id = 'x'.repeat(65);
    const read = readStudyDocument(doc);
    if (!read.ok) throw new Error(read.message);
    expect(read.document.scenarios.slice(0, 2).map((s) => s.id)).toEqual(['scenario-1', 'scenario-2']);
  });
});

describe('diffDocuments on the exhaust side of a plan', () => {
  // A valid exhaust block (shared/schemas/compute.ts exhaustSchema); its numbers are test inputs, not physics.
  const exhaust = () => ({
    housing: 'single' as const,
    wastegates: { count: 1 as const, valveDiameter: 0.038, dischargeCoefficient: 0.8 },
    mechanicalEfficiency: 0.95,
    turbineInletTemperature: [
      { rpm: 3000, value: 1073.15 },
      { rpm: 6000, value: 1223.15 },
    ],
    downstreamLoss: { pressureLoss: 15_000 },
  });
  const withExhaust = () => {
    const doc = demoJson();
    Object.assign(doc.plans[0], { exhaust: exhaust(), turbineMapId: 'builtin-turbine-a' });
    return studyDocumentSchema.parse(doc);
  };

  it('reads a changed valve diameter in words, as a diameter', () => {
    const a = withExhaust();
    const b = withExhaust();
    b.plans[0].exhaust!.wastegates.valveDiameter = 0.044;
    expect(diffDocuments(a, b)).toEqual([
      {
        // demo plan name (data/demo/hillclimb-study.json); 38 → 44 mm are the test's own inputs
        path: 'Plan “S44 street wheel” › exhaust side › wastegates › wastegate valve diameter',
        keys: ['plans', 0, 'exhaust', 'wastegates', 'valveDiameter'],
        change: 'changed',
        before: 0.038,
        after: 0.044,
        kind: 'diameter',
      },
    ]);
  });

  it('matches the turbine inlet temperature table by rpm and reads its values as temperatures', () => {
    const a = withExhaust();
    const b = withExhaust();
    b.plans[0].exhaust!.turbineInletTemperature[1].value = 1173.15;
    b.plans[0].exhaust!.turbineInletTemperature.splice(1, 0, { rpm: 4500, value: 1123.15 });
    expect(diffDocuments(a, b).map((c) => [c.path, c.change, c.before, c.after, c.kind])).toEqual([
      // Rows of the test's own table above: one added at 4500 rpm, the one at 6000 rpm changed.
      ['Plan “S44 street wheel” › exhaust side › turbine inlet temperature at 4500 rpm', 'added', undefined, 1123.15, 'temperature'],
      ['Plan “S44 street wheel” › exhaust side › turbine inlet temperature at 6000 rpm', 'changed', 1223.15, 1173.15, 'temperature'],
    ]);
  });

  it('gives the other exhaust fields their words and kinds', () => {
    const a = withExhaust();
    const b = withExhaust();
    const ex = b.plans[0].exhaust!;
    ex.housing = 'divided';
    ex.wastegates.count = 2;
    ex.wastegates.dischargeCoefficient = 0.7;
    ex.mechanicalEfficiency = 0.93;
    ex.downstreamLoss.pressureLoss = 20_000;
    ex.pulseFactor = 1.1;
    ex.turbineEfficiency = 0.68;
    b.plans[0].turbineMapId = 'builtin-turbine-b';
    const head = 'Plan “S44 street wheel” › ';
    // Values are the test's own inputs; words and kinds as defined in shared/study/diff.ts.
    expect(diffDocuments(a, b).map((c) => [c.path.replace(head, ''), c.kind])).toEqual([
      ['exhaust side › turbine housing', 'text'],
      ['exhaust side › wastegates › count', 'count'],
      ['exhaust side › wastegates › wastegate discharge coefficient', 'fraction'],
      ['exhaust side › mechanical efficiency', 'fraction'],
      ['exhaust side › pressure loss after the turbine › pressure loss', 'pressure'],
      ['exhaust side › pulse-energy factor', 'ratio'],
      ['exhaust side › default turbine efficiency', 'fraction'],
      ['turbine map', 'text'],
    ]);
  });

  it('reports an exhaust side added to a plan as one object', () => {
    const a = demoJson();
    const b = withExhaust();
    expect(diffDocuments(a, b).map((c) => [c.path, c.change, c.kind])).toEqual([
      ['Plan “S44 street wheel” › exhaust side', 'added', null],
      ['Plan “S44 street wheel” › turbine map', 'added', 'text'],
    ]);
  });
});

describe('kindOfPath', () => {
  it('knows the gauge and absolute pressures of the document apart', () => {
    expect(kindOfPath(['fuelSystem', 'injectors', 'fuelPressure'])).toBe('pressureGauge');
    expect(kindOfPath(['scenarios', 0, 'ambient', 'pressure'])).toBe('pressure');
    expect(kindOfPath(['engine', 'limits', 'maxManifoldPressure'])).toBe('pressure');
    expect(kindOfPath(['scenarios', 0, 'boostSchedule', 0, 'boost', 2, 'value'])).toBe('pressureGauge');
    expect(kindOfPath(['plans', 1, 'exhaust', 'downstreamLoss'])).toBe('pressure'); // a pressure loss like the inlet and charge-cooler losses: plain kPa/psi, no "gauge" (physics note §5, p4 = p_amb + loss)
  });

  it('knows the exhaust leaves', () => {
    expect(kindOfPath(['plans', 0, 'exhaust', 'wastegates', 'valveDiameter'])).toBe('diameter');
    expect(kindOfPath(['plans', 0, 'exhaust', 'turbineInletTemperature', 3, 'value'])).toBe('temperature');
    expect(kindOfPath(['plans', 0, 'exhaust', 'turbineInletTemperature', 3, 'rpm'])).toBe('speed');
    expect(kindOfPath(['plans', 0, 'turbineMapId'])).toBe('text');
  });

  it('gives null for keys it does not know', () => {
    expect(kindOfPath(['somethingElse'])).toBeNull();
  });
});
