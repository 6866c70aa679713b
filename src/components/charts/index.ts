export * from './line-chart';
export * from './scale';
