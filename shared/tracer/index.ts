/**
 * The Tracer's pure parts: axis scales, the least-squares affine calibration from reference
 * clicks, the picture header check (PNG and JPEG by their bytes), the trace state kept in drafts,
 * and the map file built from a trace and checked exactly as an upload is.
 */
export * from './axes';
export * from './affine';
export * from './calibration';
export * from './image-header';
export * from './state';
export * from './build';
export * from './api';
