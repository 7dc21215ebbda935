import { deleteOrder } from './business-tables';
import { exportFileName, tableCsv } from './export-files';

describe('tableCsv (RFC 4180)', () => {
  const columns = [
    { name: 'name', type: 'text' },
    { name: 'amount_minor', type: 'integer' },
    { name: 'at', type: 'timestamp with time zone' },
  ];

  it('writes a header row and CRLF-ended rows, quoting commas, quotes and line breaks', () => {
    const csv = tableCsv(columns, [
      ['Shine, "Best" Co', '1200', '2026-03-04 10:00:00+00'],
      ['two\r\nlines', null, null],
    ]);
    expect(csv).toBe(
      'name,amount_minor,at\r\n' +
        '"Shine, ""Best"" Co",1200,2026-03-04 10:00:00+00\r\n' +
        '"two\r\nlines",,\r\n',
    );
  });

  it('defuses text a spreadsheet would run as a formula, never a number', () => {
    const csv = tableCsv(columns, [['=HYPERLINK("x")', '-500', '@now']]);
    expect(csv.split('\r\n')[1]).toBe(`"'=HYPERLINK(""x"")",-500,'@now`);
  });
});

describe('exportFileName', () => {
  it('is made of the name in plain lower-case ASCII and the UTC day', () => {
    const at = new Date('2026-03-04T23:30:00Z');
    expect(exportFileName('Shine & Co. Ōsaka', at, 'json')).toBe(
      'panelpass-shine-co-osaka-2026-03-04.json',
    );
    expect(exportFileName('"; rm -rf /', at, 'zip')).toBe('panelpass-rm-rf-2026-03-04.zip');
    expect(exportFileName('🚗🚗', at, 'zip')).toBe('panelpass-business-2026-03-04.zip');
  });

  it('keeps at most 40 characters of the name, never ending in a dash', () => {
    const name = exportFileName(`${'a'.repeat(39)} b`, new Date('2026-01-01T00:00:00Z'), 'json');
    expect(name).toBe(`panelpass-${'a'.repeat(39)}-2026-01-01.json`);
  });
});

describe('deleteOrder', () => {
  it('puts every table before the tables it refers to', () => {
    const keys = [
      { from: 'jobs', to: 'businesses' },
      { from: 'jobs', to: 'customers' },
      { from: 'customers', to: 'businesses' },
      { from: 'passes', to: 'jobs' },
      { from: 'passes', to: 'passes' },
      { from: 'refresh_tokens', to: 'customers' },
    ];
    const order = deleteOrder(['businesses', 'customers', 'jobs', 'passes', 'audit'], keys);
    expect(order).toHaveLength(5);
    for (const k of keys.filter((k) => k.from !== k.to && order.includes(k.from))) {
      expect(order.indexOf(k.from)).toBeLessThan(order.indexOf(k.to));
    }
    expect(order[order.length - 1]).toBe('businesses');
  });

  it('still lists tables caught in a cycle, at the end', () => {
    const order = deleteOrder(
      ['a', 'b', 'c'],
      [
        { from: 'a', to: 'b' },
        { from: 'b', to: 'a' },
      ],
    );
    expect(order).toEqual(['c', 'a', 'b']);
  });
});
