export * from './stages';
export * from './ids';
export * from './checklists';
export * from './money';
export * from './window';
