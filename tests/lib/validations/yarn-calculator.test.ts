import { describe, expect, it } from 'vitest';
import { yarnCalculatorQuerySchema, yarnCalculatorQueryString } from '@/lib/validations/yarn-calculator';

const parse = (q: string) => yarnCalculatorQuerySchema.safeParse(Object.fromEntries(new URLSearchParams(q)));

describe('the yarn calculator query', () => {
  it('defaults to 5 % waste, nominal content and no garments (5 %: common practice, no published source)', () => {
    expect(parse('').data).toEqual({ waste: 5, method: 'nominal', qty: {} });
  });

  it('reads garments per size, and the screen’s query string round-trips, commas and colons in labels included', () => {
    expect(parse('waste=7,5&method=eu-allowance&qty=S:10,M:20').data).toEqual({ waste: 7.5, method: 'eu-allowance', qty: { S: 10, M: 20 } });
    const garments = { 'XS (32)': 5, 'S/M': 12, 'L,T': 3, '8:10': 1 };
    const q = yarnCalculatorQueryString({ wastePct: 5, method: 'nominal', garments });
    expect(parse(q).data?.qty).toEqual(garments);
  });

  it('refuses what is not a whole number of garments, a size twice, or a malformed pair', () => {
    for (const bad of ['qty=S:1.5', 'qty=S:-1', 'qty=S:abc', 'qty=S:1,S:2', 'qty=S', 'qty=:4', 'qty=%E0%A4%A:3', 'qty=S:2000000']) {
      expect(parse(bad).success, bad).toBe(false);
    }
    expect(parse('waste=60').success).toBe(false);
    expect(parse('method=weight').success).toBe(false);
  });
});
