// The studies feature's query hooks. Other features may import these (and only these) from here.
export * from './keys';
export * from './get-studies';
export * from './get-study';
export * from './create-study';
export * from './save-study';
export * from './update-study-meta';
export * from './delete-study';
export * from './duplicate-study';
export * from './get-revisions';
export * from './get-revision';
export * from './restore-revision';
export * from './get-share-links';
export * from './create-share-link';
export * from './revoke-share-link';
export * from './results-csv';
export * from './copy-study';
