export * from './root';
