export * from './app-shell';
export * from './destinations';
export * from './shell-when-signed-in';
