import type { CommandName } from '@panelpass/shared';

/** Each change in the detailer's words, for the list of changes the server refused. */
const WORDS: Record<CommandName, string> = {
  'customer.create': 'New customer',
  'customer.update': 'Customer details changed',
  'customer.remove': 'Customer removed',
  'vehicle.create': 'New vehicle',
  'vehicle.update': 'Vehicle details changed',
  'vehicle.remove': 'Vehicle removed',
  'product.create': 'Product put on the Shelf',
  'product.update': 'Product details changed',
  'stock.adjust': 'Stock counted or delivered',
  'job.create': 'Job booked',
  'job.update': 'Job details changed',
  'job.setStage': 'Job moved to another stage',
  'job.assign': 'Job given to a helper',
  'job.remove': 'Job removed',
  'pin.add': 'Damage marked',
  'pin.update': 'Damage mark changed',
  'pin.remove': 'Damage mark removed',
  'reading.add': 'Paint reading',
  'panel.update': 'Panel details changed',
  'pass.log': 'Pass logged',
  'chip.add': 'Chip added',
  'chip.addLayer': 'Touch-up layer',
  'solvent.apply': 'Solvent applied',
  'solvent.flush': 'Solvent flushed off',
  'mask.add': 'Masking put on',
  'mask.remove': 'Masking taken off',
  'timer.start': 'Timer started',
  'timer.pause': 'Timer paused',
  'timer.resume': 'Timer resumed',
  'timer.ack': 'Timer alarm seen',
  'timer.cancel': 'Timer stopped',
  'check.toggle': 'Checklist ticked',
  'climate.record': 'Weather reading',
  'photo.attach': 'Photo',
  'signature.capture': 'Signature',
  'payment.recordCash': 'Cash or cheque payment',
  'payment.request': 'Card payment link asked for',
};

export function commandWords(name: string): string {
  return (WORDS as Record<string, string>)[name] ?? name;
}
