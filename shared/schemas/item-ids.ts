/**
 * Identities of a study's scenarios and boost rows. Documents saved before these had ids carry
 * none; every reader fills them here (through `migrateStudyDocument`), so a study's history can
 * match scenarios and rows by who they are rather than by where they stand.
 *
 * The filling is deterministic (a document read twice gets the same ids): an item keeps a usable
 * id it already has; an item without one, or the second of two items sharing one (a copy made
 * by duplicating), gets the first free `<prefix>-<n>`, counting from its position. A document whose
 * items all have distinct ids is returned unchanged.
 */

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const usable = (id: unknown): id is string => typeof id === 'string' && id.length > 0 && id.length <= 64;

/** A list with an id on every object item; the same array when nothing needed filling. */
export function fillListIds(items: unknown[], prefix: string): unknown[] {
  const taken = new Set<string>();
  const keeps = items.map((item) => {
    if (!isRecord(item) || !usable(item.id) || taken.has(item.id)) return false;
    taken.add(item.id);
    return true;
  });
  if (keeps.every((keep, i) => keep || !isRecord(items[i]))) return items;
  return items.map((item, i) => {
    if (keeps[i] || !isRecord(item)) return item;
    let n = i + 1;
    while (taken.has(`${prefix}-${n}`)) n++;
    const id = `${prefix}-${n}`;
    taken.add(id);
    return { ...item, id };
  });
}

/** The document with an id on every scenario and every boost row (a shallow copy where any was filled). */
export function fillItemIds<T>(doc: T): T {
  if (!isRecord(doc) || !Array.isArray(doc.scenarios)) return doc;
  let changed = false;
  const withRows = doc.scenarios.map((s) => {
    if (!isRecord(s) || !Array.isArray(s.boostSchedule)) return s;
    const rows = fillListIds(s.boostSchedule, 'row');
    if (rows === s.boostSchedule) return s;
    changed = true;
    return { ...s, boostSchedule: rows };
  });
  const scenarios = fillListIds(withRows, 'scenario');
  if (scenarios !== withRows) changed = true;
  return changed ? ({ ...doc, scenarios } as T) : doc;
}
