import { describe, expect, it } from 'vitest';
import type { PhotoRow } from '@panelpass/shared';
import { selectPhotos } from './usePhotos';

function photo(id: string, over: Partial<PhotoRow>): PhotoRow {
  return {
    id,
    businessId: 'b',
    version: 0,
    createdAt: '2025-05-02T08:00:00.000Z',
    updatedAt: '2025-05-02T08:00:00.000Z',
    deletedAt: null,
    jobId: 'j',
    vehicleId: 'v',
    subjectType: null,
    subjectId: null,
    kind: 'before',
    sha256: id.padEnd(64, '0'),
    mime: 'image/jpeg',
    width: 1600,
    height: 1200,
    bytes: 1000,
    caption: '',
    takenAt: '2025-05-02T08:00:00.000Z',
    ...over,
  };
}

describe('selectPhotos: which photos a strip shows', () => {
  const rows = [
    photo('c', { kind: 'after', takenAt: '2025-05-02T12:00:00.000Z' }),
    photo('a', { kind: 'before', takenAt: '2025-05-02T08:10:00.000Z' }),
    photo('b', {
      kind: 'damage',
      subjectType: 'pin',
      subjectId: 'pin-1',
      takenAt: '2025-05-02T08:05:00.000Z',
    }),
  ];

  it('keeps the kinds asked for, oldest first', () => {
    expect(selectPhotos(rows, { kinds: ['before', 'damage'] }).map((p) => p.id)).toEqual([
      'b',
      'a',
    ]);
    expect(selectPhotos(rows, { kinds: ['after'] }).map((p) => p.id)).toEqual(['c']);
  });

  it('keeps the photos of one subject (a pin)', () => {
    expect(selectPhotos(rows, { subjectType: 'pin', subjectId: 'pin-1' }).map((p) => p.id)).toEqual(
      ['b'],
    );
    expect(selectPhotos(rows, { subjectType: null }).map((p) => p.id)).toEqual(['a', 'c']);
  });
});
