export * from './gas';
export * from './atmosphere';
export * from './airflow';
export * from './compressor';
export * from './fuel';
export * from './injectors';
export * from './power';
