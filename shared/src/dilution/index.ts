export * from './dilution';
