import { describe, expect, it } from 'vitest';
import type { CustomerRow, VehicleRow } from '@panelpass/shared';
import { plateKey, searchClients, vehicleName } from './clients';

const base = {
  businessId: 'b',
  version: 1,
  createdAt: '2025-05-01T10:00:00.000Z',
  updatedAt: '2025-05-01T10:00:00.000Z',
  deletedAt: null,
};
const customer = (id: string, over: Partial<CustomerRow>): CustomerRow => ({
  ...base,
  id,
  name: '',
  email: null,
  phone: null,
  address: '',
  lat: null,
  lng: null,
  notes: '',
  ...over,
});
const vehicle = (id: string, customerId: string, over: Partial<VehicleRow>): VehicleRow => ({
  ...base,
  id,
  customerId,
  make: '',
  model: '',
  year: null,
  bodyStyle: 'sedan',
  colour: '',
  paintNotes: '',
  plate: null,
  ...over,
});

const ada = customer('c-ada', {
  name: 'Ada Fernhill',
  email: 'ada.fernhill@customers.example',
  phone: '555-0141',
});
const corin = customer('c-corin', {
  name: 'Corin Waylock',
  email: 'corin@customers.example',
  phone: '555-0188',
});
const ines = customer('c-ines', { name: 'Inès Marlowe', phone: null });
const customers = [corin, ines, ada];
const vehicles = [
  vehicle('v-pickup', 'c-ada', {
    make: 'Harrow',
    model: 'Ridgeback',
    year: 2019,
    colour: 'white',
    plate: 'LKB 4471',
  }),
  vehicle('v-wagon', 'c-corin', {
    make: 'Tessaly',
    model: 'Longroof',
    colour: 'dark green',
    plate: 'LKB 2093',
  }),
];
const names = (q: string) => searchClients(customers, vehicles, q).map((e) => e.customer.name);

describe('searchClients', () => {
  it('lists everyone by name when nothing is typed, each with their vehicles', () => {
    const all = searchClients(customers, vehicles, '');
    expect(all.map((e) => e.customer.name)).toEqual([
      'Ada Fernhill',
      'Corin Waylock',
      'Inès Marlowe',
    ]);
    expect(all[0]!.vehicles.map((v) => v.id)).toEqual(['v-pickup']);
    expect(all[2]!.vehicles).toEqual([]);
  });

  it('finds by a plate however it is spaced or cased, and says which vehicle', () => {
    expect(names('lkb4471')).toEqual(['Ada Fernhill']);
    expect(names('KB 20')).toEqual(['Corin Waylock']);
    expect(searchClients(customers, vehicles, 'LKB 4471')[0]!.plateMatches).toEqual(['v-pickup']);
    expect(names('LKB')).toEqual(['Ada Fernhill', 'Corin Waylock']);
  });

  it('finds by name (any order, accents or not), e-mail and phone digits', () => {
    expect(names('fernhill ada')).toEqual(['Ada Fernhill']);
    expect(names('ines')).toEqual(['Inès Marlowe']);
    expect(names('corin@customers')).toEqual(['Corin Waylock']);
    expect(names('0188')).toEqual(['Corin Waylock']);
    expect(names('555 0141')).toEqual(['Ada Fernhill']);
    expect(names('dark green')).toEqual(['Corin Waylock']);
    expect(names('nobody')).toEqual([]);
  });
});

describe('vehicle words', () => {
  it('names a vehicle and keys a plate', () => {
    expect(vehicleName(vehicles[0]!)).toBe('White 2019 Harrow Ridgeback');
    expect(vehicleName(vehicle('v', 'c', {}))).toBe('Vehicle');
    expect(plateKey(' lkb-44 71 ')).toBe('LKB4471');
  });
});
