export * from './users';
export * from './apiaries';
export * from './hives';
