export * from './app-shell';
export * from './destinations';
