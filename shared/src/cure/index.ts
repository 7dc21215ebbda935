export * from './temperature-factor';
export * from './product';
export * from './cure-clock';
export * from './planner';
