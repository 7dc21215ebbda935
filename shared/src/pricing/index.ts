export * from './exact';
export * from './money';
export * from './quote';
export * from './labour';
export * from './settings'; // a quote priced from the business settings (phone and server)
