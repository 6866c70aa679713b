export * from './library-screen';
