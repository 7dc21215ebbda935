import Decimal from 'decimal.js';
import fc from 'fast-check';
import { csvField, minorToDecimal, safeText, toCsv } from './csv';

/** RFC 4180, read back: the inverse the writer must satisfy (written apart from it). */
function readCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        field += '"';
        i++;
      } else if (c === '"') quoted = false;
      else field += c;
    } else if (c === '"') quoted = true;
    else if (c === ',') {
      row.push(field);
      field = '';
    } else if (c === '\r' && text[i + 1] === '\n') {
      row.push(field);
      rows.push(row);
      row = [];
      field = '';
      i++;
    } else field += c;
  }
  return rows;
}

describe('CSV for an accountant (RFC 4180)', () => {
  it('quotes a field only when it holds a comma, a quote, a line break or edge spaces', () => {
    expect(csvField('plain')).toBe('plain');
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField('two\r\nlines')).toBe('"two\r\nlines"');
    expect(csvField(' padded')).toBe('" padded"');
    expect(csvField(null)).toBe('');
    expect(csvField(42)).toBe('42');
  });

  it('ends every line, the last too, with CRLF', () => {
    expect(toCsv(['A', 'B'], [['1', null]])).toBe('A,B\r\n1,\r\n');
  });

  it('any table of text reads back exactly as written', () => {
    fc.assert(
      fc.property(
        fc.array(fc.array(fc.string({ unit: 'grapheme' }), { minLength: 3, maxLength: 3 }), {
          maxLength: 8,
        }),
        (rows) => {
          const header = ['one', 'two', 'three'];
          expect(readCsv(toCsv(header, rows))).toEqual([header, ...rows]);
        },
      ),
    );
  });

  it('names that a spreadsheet would run as a formula get an apostrophe first', () => {
    for (const start of ['=', '+', '-', '@', '\t']) {
      expect(safeText(`${start}SUM(A1)`)).toBe(`'${start}SUM(A1)`);
    }
    expect(safeText('Ada Fernhill')).toBe('Ada Fernhill');
    expect(safeText(null)).toBeNull();
  });

  it('minor units become the currency’s decimal exactly (checked against decimal.js)', () => {
    for (const [currency, digits] of [
      ['USD', 2],
      ['JPY', 0],
      ['BHD', 3],
    ] as const) {
      fc.assert(
        fc.property(fc.integer({ min: -1e15, max: 1e15 }), (minor) => {
          const expected = new Decimal(minor).div(10 ** digits).toFixed(digits);
          expect(minorToDecimal(minor, currency)).toBe(expected);
        }),
      );
    }
    expect(minorToDecimal(-5, 'USD')).toBe('-0.05');
    expect(() => minorToDecimal(0.5, 'USD')).toThrow(RangeError);
  });
});
