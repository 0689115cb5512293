/**
 * The study input checked at the boundary: the engine (runStudy) takes input this has passed and
 * checks nothing itself.
 */
import { studyInputSchema, type StudyInput } from '../matching/input/study';
import { issuePath } from './issue-path';

/** Refused study input: every issue with its dotted field path. */
export class StudyInputError extends Error {
  constructor(readonly issues: { path: string; message: string }[]) {
    super(`Invalid study input: ${issues[0]?.path}: ${issues[0]?.message}`);
    this.name = 'StudyInputError';
  }
}

/** Parses a study input with the study schema, or throws StudyInputError naming each bad field. */
export function parseStudyInput(input: unknown): StudyInput {
  const result = studyInputSchema.safeParse(input);
  if (!result.success) throw new StudyInputError(result.error.issues.map((i) => ({ path: issuePath(i.path, '(study)'), message: i.message })));
  return result.data;
}
