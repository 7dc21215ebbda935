import { describe, expect, it } from 'vitest';
import { childId } from './ids';

describe('childId', () => {
  // RFC 9562 §A.4 example: the DNS namespace and "www.example.com" give this version-5 UUID.
  it('matches the RFC 9562 version-5 example', () => {
    expect(childId('6ba7b810-9dad-11d1-80b4-00c04fd430c8', 'www.example.com')).toBe(
      '2ed6657d-e927-568b-95e1-2665a8aea6a2',
    );
  });

  it('differs per parent and per key, and is stable', () => {
    const job = '1b4e28ba-2fa1-4d2b-883f-0016d3cca427';
    expect(childId(job, 'roof')).toBe(childId(job, 'roof'));
    expect(childId(job, 'roof')).not.toBe(childId(job, 'hood'));
    expect(childId('2b4e28ba-2fa1-4d2b-883f-0016d3cca427', 'roof')).not.toBe(childId(job, 'roof'));
  });
});
