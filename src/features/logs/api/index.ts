// The logged-runs feature's query hooks.
export * from './keys';
export * from './get-logs';
export * from './upload-log';
export * from './change-log';
export * from './get-log-samples';
export * from './presets';
