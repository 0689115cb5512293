/** The matching engine's entry points: a whole study, and the Working of one of its points. */
export { runStudy, type RunStudyOptions } from './run-study';
export { pointWorking } from './explain-point';
export type { StudyResult } from './result';
