import { useMemo, useState, type ReactNode } from 'react';
import { studyDocumentSchema } from '#shared/schemas/study';
import { EditorContext, type Editor } from '#src/features/studies/components/editor/context';
import { issuesByPath, setIn, type StudyDraft } from '#src/features/studies/lib/draft';
import { UnitSystemProvider, type UnitSystem } from '#src/lib/quantities';

/**
 * Parts of the study editor over a live draft, as the study page holds it: every edit writes the
 * draft and the study schema names its problems by path. `onDraft` sees each draft rendered.
 */
export function EditorHost({
  start,
  unitSystem = 'si',
  readOnly = false,
  onDraft,
  children,
}: {
  start: StudyDraft;
  unitSystem?: UnitSystem;
  readOnly?: boolean;
  onDraft?: (draft: StudyDraft) => void;
  children: ReactNode;
}) {
  const [draft, setDraft] = useState<StudyDraft>(() => structuredClone(start));
  const parsed = useMemo(() => studyDocumentSchema.safeParse(draft), [draft]);
  onDraft?.(draft);
  const editor: Editor = {
    draft,
    update: (path, value) => setDraft((d) => setIn(d, path, value)),
    issues: parsed.success ? {} : issuesByPath(parsed.error.issues),
    readOnly,
  };
  return (
    <UnitSystemProvider system={unitSystem}>
      <EditorContext value={editor}>{children}</EditorContext>
    </UnitSystemProvider>
  );
}
