// Public API of @panelpass/shared. Each area re-exports its own module.
export * from './errors';
export * from './reasons';
export * from './climate';
export * from './cure';
export * from './dwell';
export * from './film';
export * from './gloss';
export * from './panels';
export * from './pricing';
export * from './dilution';
