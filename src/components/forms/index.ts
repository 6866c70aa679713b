export * from './form-text-field';
export * from './server-errors';
export * from './validate';
