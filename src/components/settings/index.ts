export * from './settings-screen';
