export * from './accept-invite-form';
export * from './auth-frame';
export * from './forgot-password-form';
export * from './reset-password-form';
export * from './sign-in-form';
export * from './sign-up-form';
