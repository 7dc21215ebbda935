export * from './gloss';
