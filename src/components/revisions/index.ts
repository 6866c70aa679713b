export * from './compare-screen';
export * from './parts';
export * from './prepare-revision-screen';
export * from './revision-scheme-panel';
export * from './revision-screen';
export * from './revisions-screen';
