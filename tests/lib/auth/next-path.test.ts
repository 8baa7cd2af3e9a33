import { describe, expect, it } from 'vitest';
import { sameOriginPath } from '@/lib/auth/next-path';

// Hostile cases after the WHATWG URL Standard, "URL parsing" (tabs and newlines removed, a backslash
// read as a slash in http and https URLs); the list itself is common practice, no published source.
describe('sameOriginPath', () => {
  it('keeps a path on this site, with its query and fragment', () => {
    expect(sameOriginPath('/styles')).toBe('/styles');
    expect(sameOriginPath('/styles/abc?tab=fit#zones')).toBe('/styles/abc?tab=fit#zones');
    expect(sameOriginPath('/a/..//b')).toBe('/a/..//b');
  });

  it.each([
    ['//evil.example'],
    ['/\\evil.example'],
    ['/\t/evil.example'],
    ['/\n/evil.example'],
    ['/\r\n/evil.example'],
    ['\\/evil.example'],
    ['https://evil.example/'],
    ['http:evil.example'],
    ['javascript:alert(1)'],
    [' /styles'],
    ['styles'],
    [''],
  ])('refuses %j and falls back to /', (next) => {
    expect(sameOriginPath(next)).toBe('/');
  });

  it('falls back when next is missing or not one string (a repeated query parameter)', () => {
    expect(sameOriginPath(undefined)).toBe('/');
    expect(sameOriginPath(null)).toBe('/');
    expect(sameOriginPath(['/styles', '//evil.example'])).toBe('/');
  });

  it('uses the fallback it is given', () => {
    expect(sameOriginPath('//evil.example', '/styles')).toBe('/styles');
  });
});
