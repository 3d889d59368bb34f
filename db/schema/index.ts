export * from './users';
export * from './apiaries';
export * from './hives';
export * from './records';
export * from './audit';
export * from './tasks';
export * from './people';
export * from './sensors';
