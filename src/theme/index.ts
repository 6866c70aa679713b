export * from './colors';
export * from './spacing';
export * from './typography';
