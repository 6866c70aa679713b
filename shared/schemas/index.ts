export * from './common';
export * from './auth';
export * from './team';
export * from './settings';
export * from './sites';
export * from './permissions';
export * from './lines';
