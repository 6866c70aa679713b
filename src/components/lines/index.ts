export * from './item-list-screen';
export * from './item-screen';
export * from './new-item-screen';
export * from './sizing-settings-screen';
