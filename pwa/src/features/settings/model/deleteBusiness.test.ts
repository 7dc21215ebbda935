import { describe, expect, it } from 'vitest';
import { deletedNote, typedNameMatches } from './deleteBusiness';

describe('typedNameMatches (the same rule as the server: exact, spaces around ignored)', () => {
  it('takes the name as it is, with spaces typed around it', () => {
    expect(typedNameMatches('Gleam & Bead', 'Gleam & Bead')).toBe(true);
    expect(typedNameMatches('  Gleam & Bead ', 'Gleam & Bead')).toBe(true);
  });

  it('refuses other capitals, a part of the name, or nothing', () => {
    expect(typedNameMatches('gleam & bead', 'Gleam & Bead')).toBe(false);
    expect(typedNameMatches('Gleam', 'Gleam & Bead')).toBe(false);
    expect(typedNameMatches('', '')).toBe(false);
    expect(typedNameMatches('   ', ' ')).toBe(false);
  });
});

describe('deletedNote', () => {
  it('names the business that was deleted', () => {
    expect(deletedNote(' Gleam & Bead ')).toMatch(/^“Gleam & Bead” was deleted/);
  });
});
