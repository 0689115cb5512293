import { FIELD_WORDS } from '#shared/study/diff';
import { getIn } from './draft';

/**
 * A dotted document path in words for the list of problems: `scenarios.1.boostSchedule.0.boost.2.value`
 * → "Scenario “1,500 m” › boost row “Full load” › boost row 3 › value".
 */
export function describePath(path: string, draft: unknown): string {
  if (path === '') return 'Study';
  const keys = path.split('.').map((k) => (/^\d+$/.test(k) ? Number(k) : k));
  const words: string[] = [];
  keys.forEach((key, i) => {
    // The value of a table row at a speed reads "volumetric efficiency at 3500 rpm", not "… › value".
    if (key === 'value' && typeof keys[i - 1] === 'number') return;
    if (typeof key === 'number') {
      const parent = keys[i - 1];
      const item = getIn(draft, keys.slice(0, i + 1)) as Record<string, unknown> | undefined;
      const name = typeof item?.name === 'string' ? item.name : typeof item?.label === 'string' ? item.label : null;
      if (parent === 'scenarios') words[words.length - 1] = `Scenario “${name ?? i + 1}”`;
      else if (parent === 'plans') words[words.length - 1] = `Plan “${name ?? key + 1}”`;
      else if (parent === 'boostSchedule') words[words.length - 1] = `boost row “${name ?? key + 1}”`;
      else if (typeof item?.rpm === 'number' && Number.isFinite(item.rpm)) words[words.length - 1] = `${words[words.length - 1]} at ${item.rpm} rpm`;
      else words.push(`row ${key + 1}`);
    } else {
      words.push(FIELD_WORDS[key] ?? key);
    }
  });
  return words.join(' › ');
}
