export * from './form-text-field';
export * from './server-errors';
export * from './validate';
export * from './form-error-banner';
