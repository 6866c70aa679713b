export * from './quick-sizing-screen';
