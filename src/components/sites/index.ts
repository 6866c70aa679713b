export * from './create-site-form';
export * from './sites-screen';
