import { describe, expect, it } from 'vitest';
import { sameLab } from '@/lib/colour/lab';

// Common practice, no published source: a stored colour read back through a float column or JSON
// may differ in the last bits, not by a visible amount.
describe('sameLab', () => {
  const navy = { L: 24.5, a: 1.8, b: -21.6 };

  it('takes a colour read back through a 4-byte float as the same colour', () => {
    expect(sameLab(navy, { L: Math.fround(24.5), a: Math.fround(1.8), b: Math.fround(-21.6) })).toBe(true);
  });

  it('tells colours apart by more than 1e-6 in any one of L*, a*, b*', () => {
    expect(sameLab(navy, { ...navy, L: 24.500002 })).toBe(false);
    expect(sameLab(navy, { ...navy, a: 1.800002 })).toBe(false);
    expect(sameLab(navy, { ...navy, b: -21.600002 })).toBe(false);
    expect(sameLab(navy, { ...navy, b: -21.6000005 })).toBe(true);
  });
});
