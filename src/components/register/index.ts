export * from './entry-screen';
export * from './new-entry-screen';
export * from './register-screen';
export * from './site-register-section';
