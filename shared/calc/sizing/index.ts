export * from './types';
export * from './hash';
export * from './library';
export * from './size-item';
export * from './settings';
export * from './batch';
