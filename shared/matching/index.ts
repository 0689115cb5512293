/** The matching engine's entry point: a whole study. */
export { runStudy } from './run-study';
export type { StudyResult } from './result';
