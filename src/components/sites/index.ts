export * from './create-site-form';
export * from './site-detail-screen';
export * from './site-edit-form';
export * from './sites-screen';
