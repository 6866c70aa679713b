/** Built-in library: insulation materials, outer finishes and thickness series. */
export * from './materials';
export * from './finishes';
export * from './series';
