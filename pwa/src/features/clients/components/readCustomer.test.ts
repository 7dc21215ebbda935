import { describe, expect, it } from 'vitest';
import { readCustomer } from './CustomerSheet';

const draft = {
  name: 'Rue Calder',
  phone: '',
  email: '',
  address: '',
  lat: '',
  lng: '',
  notes: '',
};

describe("a customer's map position, typed for drive times", () => {
  it('takes decimal degrees, with a comma or a point, and stores numbers', () => {
    const read = readCustomer({ ...draft, lat: '51,5072', lng: '-0.1276' });
    expect(read).toMatchObject({ ok: true, fields: { lat: 51.5072, lng: -0.1276 } });
  });

  it('leaves both empty as no position', () => {
    expect(readCustomer(draft)).toMatchObject({ ok: true, fields: { lat: null, lng: null } });
  });

  it('names the field that is out of range or not a number, and wants both or neither', () => {
    const bad = readCustomer({ ...draft, lat: '91', lng: 'east' });
    expect(bad).toMatchObject({ ok: false });
    if (bad.ok) return;
    expect(bad.problems.lat).toMatch(/-90 to 90/);
    expect(bad.problems.lng).toMatch(/-180 to 180/);
    const half = readCustomer({ ...draft, lat: '51.5' });
    expect(half.ok ? null : half.problems.lng).toMatch(/both/);
  });
});
