import { describe, expect, it } from 'vitest';
import { filmWords, flagWords, outlineWords, pinWords } from './conditionRecordWords';

const pin = {
  id: 'p1',
  number: 1,
  x: 0.4,
  y: 0.2,
  panelKey: 'hood',
  panelLabel: 'Hood',
  kind: 'chip',
  severity: 2,
  note: ' Three chips ',
  photoSha256: null,
};

describe('condition record words', () => {
  it('says a pin in words: what, how bad, where, the note', () => {
    expect(pinWords(pin)).toBe('Chip, noticeable (2 of 3), on the Hood: Three chips');
    expect(pinWords({ ...pin, panelLabel: null, note: '' })).toBe(
      'Chip, noticeable (2 of 3), not on one panel',
    );
  });

  it("shows film in the business's unit, a dash when not measured", () => {
    expect(filmWords(120, 'um')).toBe('120 µm');
    expect(filmWords(127, 'mil')).toBe('5 mil');
    expect(filmWords(null, 'um')).toBe('–');
  });

  it('names flags and describes the outline for screen readers', () => {
    expect(flagWords(['probably-repainted', 'thin'])).toBe('probably repainted, thin film');
    expect(
      outlineWords({ pins: [pin], vehicle: { label: '', bodyStyle: 'sedan', plate: '' } }),
    ).toMatch(/1 numbered mark;/);
  });
});
