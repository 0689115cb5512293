import { createContext, useContext } from 'react';
import type { DocPath, StudyDraft } from '#src/features/studies/lib/draft';

/** What every input of the study editor reads and writes through. */
export interface Editor {
  /** The document being edited: the study document's shape, values possibly missing or invalid. */
  draft: StudyDraft;
  /** Puts an SI value (or text) at `path`; undefined removes an optional field. */
  update: (path: DocPath, value: unknown) => void;
  /** Schema issues of the draft, by dotted path. */
  issues: Record<string, string>;
  /** Viewers and archived studies: every input is shown but none can be changed. */
  readOnly: boolean;
}

export const EditorContext = createContext<Editor | null>(null);

export function useEditor(): Editor {
  const editor = useContext(EditorContext);
  if (!editor) throw new Error('useEditor outside the study editor');
  return editor;
}
