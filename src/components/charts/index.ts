export * from './line-chart';
export * from './scale';
export * from './bar-chart';
