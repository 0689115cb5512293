// The Tracer's query hooks and API calls.
export * from './keys';
export * from './get-drafts';
export * from './get-draft';
export * from './get-pictures';
export * from './start-trace';
export * from './save-draft';
export * from './save-to-library';
export * from './delete-draft';
