/**
 * The invented demo business: a one-person mobile finishing business in the invented town of
 * Larkspur Bay, with one helper. Every name, address and number here is made up.
 */
export const DEMO_PASSWORD = 'detail-demo-1';

export const demoBusiness = {
  name: 'Heronwake Mobile Finish',
  town: 'Larkspur Bay',
};

export const demoPeople = [
  { key: 'owner', email: 'owner@heronwake.example', name: 'Mara Ellison', role: 'owner' },
  { key: 'helper', email: 'helper@heronwake.example', name: 'Tobin Reyes', role: 'tech' },
] as const;
