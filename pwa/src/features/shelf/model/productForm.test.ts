import { describe, expect, it } from 'vitest';
import type { ProductRow } from '@panelpass/shared';
import {
  changesOf,
  draftOf,
  emptyDraft,
  propertyLines,
  readDraft,
  type FormUnits,
} from './productForm';

const celsius: FormUnits = {
  temperatureSymbol: '°C',
  toC: (v) => v,
  fromC: (c) => c,
  currencyDigits: 2,
};
const fahrenheit: FormUnits = {
  temperatureSymbol: '°F',
  toC: (f) => ((f - 32) * 5) / 9,
  fromC: (c) => (c * 9) / 5 + 32,
  currencyDigits: 2,
};

const row: ProductRow = {
  id: 'p-1',
  businessId: 'b',
  version: 4,
  createdAt: '2025-05-01T10:00:00.000Z',
  updatedAt: '2025-05-01T10:00:00.000Z',
  deletedAt: null,
  name: 'Touch-up paint, dark green',
  kind: 'touch-up',
  properties: {
    refC: 20,
    flashMinAtRef: 10,
    cureMinAtRef: 240,
    minC: 10,
    maxC: 35,
    maxRhPercent: 85,
  },
  unit: 'mL',
  stockQty: 30,
  amountPerUse: 0.2,
  unitCostMinor: 60,
  lowStockAt: 5,
  sdsUrl: 'https://sds.invalid/touch-up-paint.pdf',
};

describe('readDraft: the server’s rules, named at the field', () => {
  it('makes product.create fields, money in minor units and stock to 3 decimals', () => {
    const read = readDraft(
      {
        ...emptyDraft('solvent'),
        name: ' Sap remover ',
        stockQty: '480,5',
        amountPerUse: '10',
        unitCost: '0.025',
        lowStockAt: '100',
        sdsUrl: 'https://sds.example/sap.pdf',
        maxDwellMin: '5',
        maxSurface: '35',
      },
      celsius,
      true,
    );
    expect(read).toEqual({
      ok: true,
      fields: {
        name: 'Sap remover',
        kind: 'solvent',
        properties: { maxDwellMin: 5, maxSurfaceC: 35 },
        unit: 'mL',
        stockQty: 480.5,
        amountPerUse: 10,
        unitCostMinor: 2.5,
        lowStockAt: 100,
        sdsUrl: 'https://sds.example/sap.pdf',
      },
    });
  });

  it('leaves properties out when none is entered (the computations use their defaults)', () => {
    const read = readDraft({ ...emptyDraft('tape'), name: 'Tape' }, celsius, true);
    expect(read.ok && read.fields.properties).toEqual({});
  });

  it('once one property is entered, the kind’s required ones are needed', () => {
    const read = readDraft(
      { ...emptyDraft('touch-up'), name: 'Paint', minTemp: '10' },
      celsius,
      true,
    );
    expect(read.ok).toBe(false);
    expect(!read.ok && Object.keys(read.problems).sort()).toEqual(
      ['cureHours', 'flashMin', 'refTemp'].sort(),
    );
  });

  it('refuses what the server refuses, in words', () => {
    const read = readDraft(
      {
        ...emptyDraft('compound'),
        name: '',
        unit: '',
        amountPerUse: '-1',
        lowStockAt: 'lots',
        sdsUrl: 'sds.example/sheet.pdf',
        cutLevel: '11',
        finishLevel: '2.5',
      },
      celsius,
      true,
    );
    expect(read.ok).toBe(false);
    if (read.ok) return;
    expect(read.problems).toEqual({
      name: 'Give the product a name.',
      unit: 'Say what stock is counted in (mL, g, m, each…).',
      amountPerUse: 'Must be 0 to 9999999.',
      lowStockAt: 'Type a number (0 to 99999999).',
      sdsUrl: 'The safety data sheet link must start with https:// (or http://).',
      cutLevel: 'Must be 0 to 10.',
      finishLevel: 'Type a whole number, 0 to 10.',
    });
  });

  it('takes temperatures in the business’s unit and stores °C; checks the window’s order', () => {
    const read = readDraft(
      {
        ...emptyDraft('protection'),
        name: 'Coat',
        refTemp: '68',
        flashMin: '5',
        cureHours: '12',
        minTemp: '50',
        maxTemp: '89.6',
      },
      fahrenheit,
      true,
    );
    expect(read.ok && read.fields.properties).toEqual({
      refC: 20,
      flashMinAtRef: 5,
      cureMinAtRef: 720,
      minC: 10,
      maxC: 32,
    });
    const upside = readDraft(
      {
        ...emptyDraft('protection'),
        name: 'Coat',
        refTemp: '20',
        flashMin: '5',
        cureHours: '1',
        minTemp: '30',
        maxTemp: '10',
      },
      celsius,
      true,
    );
    expect(!upside.ok && upside.problems.minTemp).toBe(
      'The lowest temperature must not be above the highest.',
    );
  });
});

describe('editing a product', () => {
  it('fills the form from the row and sends nothing when nothing changed', () => {
    const draft = draftOf(row, celsius);
    expect(draft).toMatchObject({
      cureHours: '4',
      unitCost: '0.6',
      refTemp: '20',
      amountPerUse: '0.2',
    });
    const read = readDraft(draft, celsius, false);
    expect(read.ok).toBe(true);
    if (!read.ok) return;
    expect(read.fields).not.toHaveProperty('stockQty');
    expect(changesOf(row, read.fields)).toBeNull();
  });

  it('sends only what changed; a new kind always brings its properties', () => {
    const read = readDraft(
      { ...draftOf(row, celsius), lowStockAt: '8', cureHours: '6' },
      celsius,
      false,
    );
    if (!read.ok) throw new Error('should read');
    expect(changesOf(row, read.fields)).toEqual({
      id: 'p-1',
      lowStockAt: 8,
      properties: { ...row.properties, cureMinAtRef: 360 },
    });
  });
});

describe('propertyLines', () => {
  it('words a paint’s flash, cure and window', () => {
    expect(propertyLines(row, (c) => `${c} °C`)).toEqual([
      { label: 'Flash between layers', value: '10 min at 20 °C' },
      { label: 'Cure before levelling', value: '4 h at 20 °C' },
      { label: 'Apply between', value: '10 °C and 35 °C' },
      { label: 'Humidity up to', value: '85 %' },
    ]);
  });
});
