export * from './templates';
export * from './progress';
