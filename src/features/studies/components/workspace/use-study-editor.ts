import { useCallback, useDeferredValue, useMemo, useState } from 'react';
import type { SpoolbookMap } from '#shared/maps/types';
import type { StudyResult } from '#shared/matching/result';
import { migrateStudyDocument, studyDocumentSchema, type StudyDocument } from '#shared/schemas/study';
import { studyLines, type StudyLine } from '#src/components/study/lines';
import { runStudyLive } from '#src/components/study/run';
import { studyMapIds } from '#shared/study/document';
import { issuesByPath, setIn, type DocPath, type StudyDraft } from '#src/features/studies/lib/draft';

/** What the editor started from: the saved revision its edits will be based on. */
export interface EditorBase {
  revision: number;
  document: StudyDraft;
}

export interface Computed {
  doc: StudyDocument;
  result: StudyResult;
  lines: StudyLine[];
}

/**
 * A stored document as the editor holds it: migrated to the current version, plain JSON. Taken
 * as a draft without checking: the schema checks the draft on every edit and names what is wrong.
 */
export function editableDocument(raw: unknown): StudyDraft {
  try {
    const migrated = migrateStudyDocument(raw);
    return migrated && typeof migrated === 'object' ? (structuredClone(migrated) as StudyDraft) : {};
  } catch {
    return {};
  }
}

/** The draft document and the saved revision it is based on. */
export function useDraft(initial: EditorBase) {
  const [base, setBase] = useState<EditorBase>(initial);
  const [draft, setDraft] = useState<StudyDraft>(initial.document);
  const update = useCallback((path: DocPath, value: unknown) => setDraft((d) => setIn(d, path, value)), []);
  const baseText = useMemo(() => JSON.stringify(base.document), [base]);
  const dirty = useMemo(() => JSON.stringify(draft) !== baseText, [draft, baseText]);

  /** Starts again from a saved revision (after loading theirs or restoring one). */
  const reset = useCallback((next: EditorBase) => {
    setBase(next);
    setDraft(next.document);
  }, []);

  /** After a save: the sent document is the new base; anything typed since stays unsaved. */
  const saved = useCallback((revision: number, document: StudyDraft) => setBase({ revision, document }), []);

  return { base, draft, update, dirty, reset, saved };
}

/** The map ids the plans of a draft name (valid or not). */
export function mapIdsOf(draft: StudyDraft): string[] {
  return studyMapIds(Array.isArray(draft.plans) ? draft.plans : []);
}

/**
 * The draft checked by the study schema (issues by path) and computed in the browser. Only a
 * valid draft with its maps loaded is computed; otherwise the last good result stays on screen.
 */
export function useStudyCompute(draft: StudyDraft, mapsById: Record<string, SpoolbookMap | undefined>, mapsReady: boolean) {
  const parsed = useMemo(() => studyDocumentSchema.safeParse(draft), [draft]);
  const issues = useMemo(() => (parsed.success ? {} : issuesByPath(parsed.error.issues)), [parsed]);
  // Typing paints first: the study is computed and drawn in a later render that React may put
  // off while keys keep coming (saving and the problems list read `parsed`, never this).
  const deferred = useDeferredValue(parsed);
  const computedNow = useMemo<Computed | null>(() => {
    if (!deferred.success || !mapsReady) return null;
    const result = runStudyLive(deferred.data, mapsById);
    return { doc: deferred.data, result, lines: studyLines(result, deferred.data.plans) };
  }, [deferred, mapsById, mapsReady]);
  const [lastGood, setLastGood] = useState<Computed | null>(null);
  if (computedNow && computedNow !== lastGood) setLastGood(computedNow);
  return { parsed, issues, valid: parsed.success, computed: computedNow ?? lastGood, stale: computedNow === null };
}
