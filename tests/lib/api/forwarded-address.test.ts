import { describe, expect, it } from 'vitest';
import { forwardedClientAddress } from '@/lib/api/forwarded-address';

// Common practice, no published source: a proxy appends the address it saw to X-Forwarded-For.
describe('forwardedClientAddress', () => {
  it('without a trusted proxy the address is unknown, whatever the header says', () => {
    expect(forwardedClientAddress(false, '203.0.113.7')).toBeNull();
    expect(forwardedClientAddress(false, null)).toBeNull();
  });

  it('behind a trusted proxy, the last entry: the one the proxy added', () => {
    expect(forwardedClientAddress(true, '203.0.113.7')).toBe('203.0.113.7');
    expect(forwardedClientAddress(true, '10.0.0.1, 198.51.100.2,203.0.113.7 ')).toBe('203.0.113.7');
  });

  it('an empty header or an empty last entry is unknown', () => {
    expect(forwardedClientAddress(true, null)).toBeNull();
    expect(forwardedClientAddress(true, '')).toBeNull();
    expect(forwardedClientAddress(true, '203.0.113.7, ')).toBeNull();
  });
});
