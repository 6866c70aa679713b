export * from './caught-mail-panel';
export * from './invitation-list';
export * from './invite-form';
export * from './member-list';
export * from './team-screen';
