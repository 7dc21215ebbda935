export * from './canonical-json';
