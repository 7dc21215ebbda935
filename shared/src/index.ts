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
export * from './route'; // drive time between stops
export * from './jobs'; // stages, child ids, checklists, amount due (keep: used by server and pwa)
export * from './records';
export * from './sync'; // the device ↔ server protocol (keep)
