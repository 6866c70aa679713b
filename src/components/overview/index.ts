export * from './overview-screen';
