export * from './units';
export * from './stats';
export * from './spots';
export * from './substrate';
export * from './baseline';
export * from './clear-coat-budget';
