import type { CommandArgs, CommandName } from '@panelpass/shared';

/**
 * One typed helper per command, named in the detailer's words: `changes.logPass({...})` is
 * `mutate('pass.log', {...})`. Photos and signatures have their own helpers (images.ts): they
 * bring an image to keep.
 */
export const CHANGE_COMMANDS = {
  addCustomer: 'customer.create',
  updateCustomer: 'customer.update',
  removeCustomer: 'customer.remove',
  addVehicle: 'vehicle.create',
  updateVehicle: 'vehicle.update',
  removeVehicle: 'vehicle.remove',
  addProduct: 'product.create',
  updateProduct: 'product.update',
  adjustStock: 'stock.adjust',
  bookJob: 'job.create',
  updateJob: 'job.update',
  moveJobStage: 'job.setStage',
  assignJob: 'job.assign',
  removeJob: 'job.remove',
  addPin: 'pin.add',
  updatePin: 'pin.update',
  removePin: 'pin.remove',
  addReading: 'reading.add',
  updatePanel: 'panel.update',
  logPass: 'pass.log',
  addChip: 'chip.add',
  addChipLayer: 'chip.addLayer',
  applySolvent: 'solvent.apply',
  flushSolvent: 'solvent.flush',
  addMask: 'mask.add',
  removeMask: 'mask.remove',
  startTimer: 'timer.start',
  pauseTimer: 'timer.pause',
  resumeTimer: 'timer.resume',
  ackTimer: 'timer.ack',
  cancelTimer: 'timer.cancel',
  toggleCheck: 'check.toggle',
  recordClimate: 'climate.record',
  recordCash: 'payment.recordCash',
  requestCardPayment: 'payment.request',
} as const satisfies Record<string, Exclude<CommandName, 'photo.attach' | 'signature.capture'>>;

export type Changes<R> = {
  [K in keyof typeof CHANGE_COMMANDS]: (
    args: CommandArgs[(typeof CHANGE_COMMANDS)[K]],
  ) => Promise<R>;
};

/** The helpers over any way of recording a command (mutate on a db, or a hook's wrapper). */
export function changesOver<R>(
  record: <N extends CommandName>(name: N, args: CommandArgs[N]) => Promise<R>,
): Changes<R> {
  const out: Record<string, (args: never) => Promise<R>> = {};
  for (const [helper, name] of Object.entries(CHANGE_COMMANDS)) {
    out[helper] = (args) => record(name, args);
  }
  return out as unknown as Changes<R>;
}
