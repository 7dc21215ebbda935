export * from './flush';
export * from './deadline';
export * from './masking';
