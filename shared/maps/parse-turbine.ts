import {
  HEADER_KEYS,
  HOUSINGS,
  TURBINE_EFFICIENCY_KIND_WORDS,
  TURBINE_OPTIONAL_KEYS,
  TURBINE_REQUIRED_KEYS,
  type Housing,
  type ScrollFeed,
  type TurbineEfficiencyKind,
} from './format';
import { checkDistinctSpeeds, checkEfficiency, checkEfficiencyScale, checkIncreasing, checkPointCount, checkSameAlongLine, groupRows } from './curves';
import { checkKeysForKind, parseDecimal, readUnitValue, type CommonHeader, type HeaderSection } from './header';
import { quoteCell, type ProblemList } from './problems';
import type { DataRow } from './rows';
import type { TurbineCurve, TurbineMap } from './types';
import { efficiencyScale, flowParameterScale, speedScale } from './scales';

const EXAMPLES: Record<string, string> = {
  [HEADER_KEYS.version]: '1',
  [HEADER_KEYS.kind]: 'turbine',
  [HEADER_KEYS.name]: 'Demo turbine 64, A/R 0.85',
  [HEADER_KEYS.flowParameter]: 'kg/s K^0.5 / kPa',
  [HEADER_KEYS.housing]: 'single',
  [HEADER_KEYS.efficiency]: 'fraction',
};

/** A/R values outside this range are a slip of the number (A/R is printed in cm or inches, both small). */
const AREA_RATIO_RANGE = [0.05, 10] as const;

function readHousing(section: HeaderSection, problems: ProblemList): Housing | null {
  const entry = section.entries.get(HEADER_KEYS.housing);
  if (!entry) return null;
  const housing = entry.value.toLowerCase();
  if ((HOUSINGS as readonly string[]).includes(housing)) return housing as Housing;
  problems.add('bad-value', entry.line, null, `housing ${quoteCell(entry.value)} is not one Spoolbook knows; write "single" or "divided"`);
  return null;
}

function readScrollFeed(section: HeaderSection, housing: Housing | null, problems: ProblemList): ScrollFeed | null | undefined {
  const entry = section.entries.get(HEADER_KEYS.scrollFeed);
  if (housing === 'single') {
    if (entry) problems.add('misplaced-key', entry.line, null, 'scroll feed applies only to a divided housing; remove it or write "# housing: divided"');
    return null;
  }
  if (!entry) {
    if (housing === 'divided')
      problems.add(
        'missing-key',
        null,
        null,
        'a divided housing needs "# scroll feed: both" (measured with both scrolls fed) or "# scroll feed: per scroll" (flow of one scroll)',
      );
    return undefined;
  }
  const value = entry.value.toLowerCase().replace(/[\s-]+/g, ' ');
  if (value === 'both') return 'both';
  if (value === 'per scroll') return 'per-scroll';
  problems.add('bad-value', entry.line, null, `scroll feed ${quoteCell(entry.value)} is not one Spoolbook knows; write "both" or "per scroll"`);
  return undefined;
}

function readAreaRatio(section: HeaderSection, problems: ProblemList): number | null | undefined {
  const entry = section.entries.get(HEADER_KEYS.areaRatio);
  if (!entry) return null;
  const value = parseDecimal(entry.value);
  const [low, high] = AREA_RATIO_RANGE;
  if (value === null) {
    problems.add('bad-value', entry.line, null, `a/r must be a number such as 0.82 (found ${quoteCell(entry.value)})`);
    return undefined;
  }
  if (!(value >= low && value <= high)) {
    problems.add('out-of-range', entry.line, null, `a/r ${value} must lie between ${low} and ${high}`);
    return undefined;
  }
  return value;
}

/** The header's efficiency kind: null when absent, undefined when not one the format knows (a problem is added). */
function readEfficiencyKind(section: HeaderSection, problems: ProblemList): TurbineEfficiencyKind | null | undefined {
  const entry = section.entries.get(HEADER_KEYS.efficiencyKind);
  if (!entry) return null;
  const loose = (text: string) =>
    text
      .toLowerCase()
      .replace(/[\s-]+/g, ' ')
      .replace(/\s*,\s*/g, ', ')
      .trim();
  const value = loose(entry.value);
  for (const [kind, words] of Object.entries(TURBINE_EFFICIENCY_KIND_WORDS) as [TurbineEfficiencyKind, string][]) if (value === loose(words)) return kind;
  problems.add(
    'bad-value',
    entry.line,
    null,
    `efficiency kind ${quoteCell(entry.value)} is not one Spoolbook knows; write "${TURBINE_EFFICIENCY_KIND_WORDS['with-bearing-losses']}" (a gas-stand efficiency that counts the bearings) or "${TURBINE_EFFICIENCY_KIND_WORDS.aerodynamic}"`,
  );
  return undefined;
}

function checkRow(row: DataRow, common: CommonHeader, problems: ProblemList): void {
  const [expansionRatio, flowParameter, efficiency, speed] = row.values;
  if (expansionRatio === null) problems.add('missing-value', row.line, 3, 'expansion_ratio is empty; every row needs an expansion ratio');
  else if (!(expansionRatio >= 1))
    problems.add(
      'pressure-ratio-below-one',
      row.line,
      3,
      `expansion ratio ${expansionRatio} is below 1; a turbine expands the gas, so the ratio is at least 1`,
    );
  if (flowParameter === null) problems.add('missing-value', row.line, 4, 'flow_parameter is empty; every row needs a flow parameter');
  else if (!(flowParameter >= 0)) problems.add('out-of-range', row.line, 4, `flow parameter ${flowParameter} must not be negative`);
  if (efficiency !== null && common.efficiency) checkEfficiency(efficiency, common.efficiency, row.line, problems);
  if (speed !== null && !(speed > 0)) problems.add('out-of-range', row.line, 6, `speed ${speed} must be above 0`);
}

/** Reads and checks a turbine file's header and rows; builds the map only when nothing is wrong. */
export function readTurbine(section: HeaderSection, common: CommonHeader, rows: DataRow[], problems: ProblemList): TurbineMap | null {
  checkKeysForKind(section, 'turbine', TURBINE_REQUIRED_KEYS, TURBINE_OPTIONAL_KEYS, EXAMPLES, problems);
  const flowParameterEntry = section.entries.get(HEADER_KEYS.flowParameter);
  const flowParameterUnit = flowParameterEntry ? readUnitValue(flowParameterEntry, 'flowParameter', problems) : null;
  const housing = readHousing(section, problems);
  const scrollFeed = readScrollFeed(section, housing, problems);
  const areaRatio = readAreaRatio(section, problems);
  const efficiencyKind = readEfficiencyKind(section, problems);

  const scaleLine = section.entries.get(HEADER_KEYS.efficiency)?.line ?? null;
  const wrongScale = checkEfficiencyScale(rows, common.efficiency, scaleLine, problems);
  for (const row of rows) checkRow(row, wrongScale ? { ...common, efficiency: null } : common, problems);
  const groups = groupRows(rows, [], problems);
  for (const group of groups) {
    if (group.duplicate) continue;
    checkPointCount(group, 2, problems);
    checkSameAlongLine(group, 6, 'speed', problems);
    checkIncreasing(group, 3, 'expansion ratio', "list a flow line's points from low to high expansion ratio", problems);
  }
  checkDistinctSpeeds(groups, problems);

  if (
    !problems.isEmpty ||
    !flowParameterUnit ||
    !housing ||
    scrollFeed === undefined ||
    areaRatio === undefined ||
    efficiencyKind === undefined ||
    !common.name ||
    !common.efficiency
  ) {
    return null;
  }
  const flowFactor = flowParameterScale(flowParameterUnit);
  const speedFactor = speedScale(common.speedUnit);
  const efficiencyFactor = efficiencyScale(common.efficiency);
  const curves: TurbineCurve[] = groups.map((group) => ({
    kind: 'flow',
    label: group.label,
    points: group.rows.map((row) => ({
      expansionRatio: row.values[0]!,
      flowParameter: row.values[1]! * flowFactor,
      efficiency: row.values[2] === null ? null : row.values[2] * efficiencyFactor,
      speed: row.values[3] === null ? null : row.values[3] * speedFactor,
    })),
  }));
  return {
    kind: 'turbine',
    formatVersion: 1,
    name: common.name,
    notes: common.notes,
    housing,
    scrollFeed,
    areaRatio,
    ...(efficiencyKind !== null ? { efficiencyKind } : {}),
    curves,
    fileUnits: { flowParameterUnit, efficiency: common.efficiency, speedUnit: common.speedUnit },
  };
}
