// The map library's queries: the one way any feature reads or changes maps. Other features import
// these (and only these) from here.
export * from './keys';
export * from './schemas';
export * from './get-maps';
export * from './get-map';
export * from './update-map';
export * from './upload-map';
export * from './delete-map';
export * from './map-file';
