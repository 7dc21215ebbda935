export * from './exact';
export * from './money';
export * from './quote';
export * from './labour';
