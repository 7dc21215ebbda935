export * from './protocol';
export * from './rows';
export * from './commands';
export * from './local-effects';
