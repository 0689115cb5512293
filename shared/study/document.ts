/**
 * Reading a saved study document: brought up to the current schema version, then checked by the
 * document schema. The one way a stored, shared or restored document becomes a StudyDocument.
 */
import { issuePath } from '../schemas/issue-path';
import { migrateStudyDocument, StudyVersionError, studyDocumentSchema, type StudyDocument } from '../schemas/study';

export type StudyDocumentRead = { ok: true; document: StudyDocument } | { ok: false; message: string; issues: { path: string; message: string }[] };

/** A stored document of any earlier version, migrated and checked; every problem by its dotted path. */
export function readStudyDocument(raw: unknown): StudyDocumentRead {
  let migrated: unknown;
  try {
    migrated = migrateStudyDocument(raw);
  } catch (err) {
    if (err instanceof StudyVersionError) return { ok: false, message: err.message, issues: [{ path: 'schemaVersion', message: err.message }] };
    throw err;
  }
  const parsed = studyDocumentSchema.safeParse(migrated);
  if (parsed.success) return { ok: true, document: parsed.data };
  const issues = parsed.error.issues.map((i) => ({ path: issuePath(i.path), message: i.message }));
  return { ok: false, message: `${issues[0].path || 'document'}: ${issues[0].message}`, issues };
}

/**
 * The ids of every map some plans name (compressor and turbine), each once, in plan order. Takes
 * plans of a checked document or of a draft being edited (anything not a map id is skipped).
 */
export function studyMapIds(plans: readonly unknown[]): string[] {
  const ids = new Set<string>();
  for (const plan of plans) {
    if (!plan || typeof plan !== 'object') continue;
    const { compressorMapId, turbineMapId } = plan as { compressorMapId?: unknown; turbineMapId?: unknown };
    if (typeof compressorMapId === 'string' && compressorMapId !== '') ids.add(compressorMapId);
    if (typeof turbineMapId === 'string' && turbineMapId !== '') ids.add(turbineMapId);
  }
  return [...ids];
}
