import { FIELD_WORDS } from '#shared/study/diff';
import { formatNumber, formatStudyValue, type StudyQuantity, type UnitSystem } from '#src/lib/quantities';

/** The SI unit each quantity's messages are written in (shared/schemas/compute.ts). */
const SI_UNIT: Partial<Record<StudyQuantity, string>> = {
  pressure: 'Pa',
  pressureGauge: 'Pa',
  temperature: 'K',
  temperatureDifference: 'K',
  volume: 'm³',
  length: 'm',
  injectorFlow: 'm³/s',
  fuelFlow: 'm³/s',
  bsfc: 'kg/J',
  speed: 'rpm',
};

function escape(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&');
}

/**
 * A schema message about one field in the words of the field's own unit. The shared schemas
 * word their limits in SI and add hints for unit slips ("(2.0 L = 0.002 m³)", "not a
 * percentage"), which help an API caller but mislead someone typing litres or percent into a
 * box that converts for them.
 */
export function localizeIssue(message: string, quantity: StudyQuantity, system: UnitSystem): string {
  let text = message
    // Field names an API caller types ("minSurgeMargin") read as words beside a labelled box.
    .replace(/\b[a-z]+(?:[A-Z][a-z]*)+\b/g, (key) => FIELD_WORDS[key] ?? key)
    // Hints about unit slips: the box converts, so there is no slip to warn about.
    .replace(/\s*\((?:[^()]*=[^()]*|not a percentage|was °C given\?)\)/g, '')
    .replace(/\b(?:is )?(?:absolute |gauge )?(?:temperature )?(?:per injector )?,?\s*in (?:Pa|K|m³\/s|m³|kg\/J)(?![\w/])[:;,]?\s*/g, ' ')
    .replace(/\s{2,}/g, ' ');
  if (quantity === 'fraction') {
    text = text
      .replace(/is a fraction from 0 to 1/g, 'must be from 0 to 100 %')
      .replace(/is a fraction above 0/g, 'must be above 0 %')
      .replace(/is a fraction, at most ([\d.]+)/g, (_m, n: string) => `must be at most ${formatNumber(Number(n) * 100)} %`)
      .replace(/(at most|at least|above|below) (1|0)(?![\d.])(?! %)/g, (_m, word: string, n: string) => `${word} ${Number(n) * 100} %`)
      .replace(/; above 1 is impossible/g, '; above 100 % is impossible');
  }
  const unit = SI_UNIT[quantity];
  if (unit && unit !== 'rpm') {
    const pattern = new RegExp(`(−|-)?(\\d[\\d\\s.]*(?:e[-+]?\\d+)?)\\s*${escape(unit)}(?![\\w/³])`, 'g');
    text = text.replace(pattern, (_m, minus: string | undefined, digits: string) => {
      const si = (minus ? -1 : 1) * Number(digits.replace(/\s/g, ''));
      return Number.isFinite(si) ? formatStudyValue(si, quantity, system) : _m;
    });
  }
  return text.replace(/:\s*$/, '').trim();
}
