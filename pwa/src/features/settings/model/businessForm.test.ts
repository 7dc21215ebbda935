import { describe, expect, it } from 'vitest';
import type { OwnerBusiness } from '../api/businessApi';
import {
  checkDraft,
  draftOf,
  idFromName,
  isChanged,
  isOnForm,
  newBand,
  newFactor,
  newService,
  removeRow,
  serverProblems,
  updateRow,
  type BusinessDraft,
} from './businessForm';

/** A business as the server answers it (its own invented figures). */
const business: OwnerBusiness = {
  id: 'b1',
  name: 'Saltmarsh Gloss Co',
  timezone: 'America/Halifax',
  currency: 'USD',
  updatedAt: '2025-01-01T00:00:00.000Z',
  settings: {
    services: [
      {
        id: 'wash',
        name: 'Wash',
        priceMinor: 5_500,
        labourMinutes: 3.5,
        labourPer: 'm2',
        step: 'wash',
      },
      {
        id: 'polish',
        name: 'Polish',
        priceMinor: 31_999,
        labourMinutes: 11,
        labourPer: 'm2',
        step: 'polish',
        taxable: false,
      },
    ],
    sizeClasses: [
      { id: 'small', name: 'Small', factor: 0.9 },
      { id: 'large', name: 'Large', factor: 1.25 },
    ],
    conditions: [{ id: 'light', name: 'Light', factor: 1 }],
    chipPriceMinor: 1_250,
    chipLabourMinutes: 10,
    addOns: [{ id: 'trim', name: 'Trim care', priceMinor: 4_000, labourMinutes: 30 }],
    travel: {
      bands: [
        { upToKm: 10, feeMinor: 0 },
        { upToKm: 25.5, feeMinor: 2_500 },
      ],
      taxable: true,
    },
    tax: { rateBp: 825, basis: 'per-invoice', rounding: 'half-up' },
    deposit: { kind: 'percent', percentBp: 2_000, roundToMinor: 100 },
    units: { thickness: 'um', temperature: 'C' },
    waits: { keepDryHours: 24, maintenanceReminderMonths: 6 },
    labourCostPerHourMinor: 3_500,
    drive: { roadFactor: 1.3, averageSpeedKmh: 45 },
    profile: { email: '', phone: '', address: '', base: null },
  },
};

const fresh = (): BusinessDraft => draftOf(business);

describe('the Settings form model', () => {
  it('shows amounts in major units and reads them back unchanged (a save of nothing changes nothing)', () => {
    const d = fresh();
    expect(d.services.map((s) => s.price)).toEqual(['55.00', '319.99']);
    expect(d.taxRate).toBe('8.25');
    expect(d.depositPercent).toBe('20');
    expect(d.depositRoundTo).toBe('1.00');
    expect(isChanged(d, business)).toBe(false);
    const { problems, patch } = checkDraft(d, 'USD');
    expect(problems).toEqual({});
    expect(patch?.settings.services[0]).toEqual({
      ...business.settings.services[0],
      taxable: true,
    });
    expect(patch?.settings.services[1]).toEqual(business.settings.services[1]);
    expect(patch?.settings.tax).toEqual(business.settings.tax);
    expect(patch?.settings.travel).toEqual(business.settings.travel);
    expect(patch?.settings.deposit).toEqual(business.settings.deposit);
    expect(patch?.settings.profile).toEqual(business.settings.profile);
    expect(patch).toMatchObject({ name: business.name, timezone: business.timezone });
  });

  it('a price typed with a comma becomes exact cents, and the form knows it changed', () => {
    const d = fresh();
    const first = d.services[0]!;
    const changed = { ...d, services: updateRow(d.services, first.key, { price: '59,99' }) };
    expect(isChanged(changed, business)).toBe(true);
    expect(checkDraft(changed, 'USD').patch?.settings.services[0]?.priceMinor).toBe(5_999);
  });

  it('rows are added with ids made from their names, changed and removed by key', () => {
    const d = fresh();
    let services = [
      ...d.services,
      { ...newService('n1'), name: 'Wash', price: '20', labourMinutes: '30' },
    ];
    services = [
      ...services,
      { ...newService('n2'), name: 'Glass coating!', price: '150', labourMinutes: '60' },
    ];
    services = updateRow(services, 'n2', { labourPer: 'job' });
    const patch = checkDraft({ ...d, services }, 'USD').patch;
    expect(patch?.settings.services.map((s) => s.id)).toEqual([
      'wash',
      'polish',
      'wash-2',
      'glass-coating',
    ]);
    expect(patch?.settings.services[3]).toMatchObject({ priceMinor: 15_000, labourPer: 'job' });

    // With the first "Wash" gone its id is free again, so the new one takes it.
    const fewer = removeRow(services, d.services[0]!.key);
    expect(
      checkDraft({ ...d, services: fewer }, 'USD').patch?.settings.services.map((s) => s.id),
    ).toEqual(['polish', 'wash', 'glass-coating']);
    expect(idFromName('Crème brûlée', new Set(), 'service')).toBe('creme-brulee');
    expect(idFromName('***', new Set(['add-on']), 'add-on')).toBe('add-on-2');
  });

  it('says what is wrong under each field, by the server’s own field names, and sends nothing', () => {
    const d = fresh();
    const bad: BusinessDraft = {
      ...d,
      name: '  ',
      timezone: 'Mars/Olympus',
      email: 'not-an-address',
      baseLat: '95',
      baseLng: '-63.5',
      services: updateRow(d.services, d.services[1]!.key, { price: '1.005', name: '' }),
      sizeClasses: [...d.sizeClasses, newFactor('f1')],
      conditions: updateRow(d.conditions, d.conditions[0]!.key, { factor: '0' }),
      bands: [...d.bands, { ...newBand('b9'), upToKm: '20', fee: '30' }],
      taxRate: '8.255',
      depositRoundTo: '0',
      reminderMonths: '6.5',
    };
    const { problems, patch } = checkDraft(bad, 'USD');
    expect(patch).toBeNull();
    expect(problems).toEqual({
      name: 'Give it a name.',
      timezone: 'A time zone of the world, like Europe/Berlin or America/Chicago.',
      'settings.profile.email': 'An e-mail address like hello@example.com, or leave it empty.',
      'settings.profile.base.lat': expect.stringMatching(/^A latitude from -90 to 90/),
      'settings.services.1.name': 'Give it a name.',
      'settings.services.1.priceMinor': 'At most 2 decimals, like 19.99.',
      'settings.sizeClasses.2.name': 'Give it a name.',
      'settings.conditions.0.factor': expect.stringMatching(/^A factor from 0.01 to 20/),
      'settings.travel.bands.2.upToKm':
        'Further than the band before it (25.5 km): bands go from near to far.',
      'settings.tax.rateBp': 'A percentage from 0 to 100, like 8.25 (two decimals at most).',
      'settings.deposit.roundToMinor':
        'Above zero, like 1.00 for whole amounts; or leave it empty to keep every cent.',
      'settings.waits.maintenanceReminderMonths': 'Months from 1 to 60, like 6 (a whole number).',
    });
    expect(Object.keys(problems).every(isOnForm)).toBe(true);
  });

  it('keeps at least one size class, condition and travel band', () => {
    const d = fresh();
    const { problems } = checkDraft({ ...d, sizeClasses: [], conditions: [], bands: [] }, 'USD');
    expect(problems['settings.sizeClasses']).toBe('Keep at least one size class.');
    expect(problems['settings.conditions']).toBe('Keep at least one condition.');
    expect(problems['settings.travel.bands']).toBe('Keep at least one band.');
  });

  it('the base position needs both figures, and is sent as numbers; a deposit by kind', () => {
    const d = fresh();
    expect(
      checkDraft({ ...d, baseLat: '44.6301' }, 'USD').problems['settings.profile.base.lng'],
    ).toMatch(/^A longitude from -180 to 180/);
    const placed = checkDraft({ ...d, baseLat: '44,6301', baseLng: '-63.5712' }, 'USD').patch;
    expect(placed?.settings.profile.base).toEqual({ lat: 44.6301, lng: -63.5712 });

    const fixed = checkDraft({ ...d, depositKind: 'fixed', depositAmount: '50' }, 'USD').patch;
    expect(fixed?.settings.deposit).toEqual({ kind: 'fixed', amountMinor: 5_000 });
    const none = checkDraft({ ...d, depositKind: 'none', depositPercent: 'junk' }, 'USD').patch;
    expect(none?.settings.deposit).toEqual({ kind: 'none' });
    const uneven = checkDraft({ ...d, depositRoundTo: '' }, 'USD').patch;
    expect(uneven?.settings.deposit).toEqual({ kind: 'percent', percentBp: 2_000 });
  });

  it("reads the server's validation details by field, and knows which ones the form shows", () => {
    const problems = serverProblems([
      { field: 'settings.travel.bands.1.upToKm', rules: { order: 'must be further' } },
      { field: 'timezone', rules: { isTimeZone: 'timezone must be an IANA time zone' } },
      { field: 'settings.services.0.id', rules: { matches: 'id must be 1–40 letters' } },
      { nonsense: true },
    ]);
    expect(problems).toEqual({
      'settings.travel.bands.1.upToKm': 'must be further',
      timezone: 'timezone must be an IANA time zone',
      'settings.services.0.id': 'id must be 1–40 letters',
    });
    expect(isOnForm('settings.travel.bands.1.upToKm')).toBe(true);
    expect(isOnForm('settings.services.0.id')).toBe(false);
    expect(serverProblems('nothing')).toEqual({});
  });
});
