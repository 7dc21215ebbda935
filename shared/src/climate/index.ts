export * from './temperature';
export * from './dew-point';
export * from './gate';
