export * from './stages';
