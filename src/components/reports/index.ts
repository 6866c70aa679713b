export * from './report-downloads';
