export * from './save-to-site-panel';
