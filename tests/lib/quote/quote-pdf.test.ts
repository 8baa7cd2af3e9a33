import { describe, expect, it } from 'vitest';
import { computeQuote, exampleValueNote, resolveRates, type QuoteInput } from '@/lib/cost';
import { quotePdf } from '@/lib/quote/quote-pdf';
import { quoteInputsSchema } from '@/lib/validations/quote';
import type { StyleQuote } from '@/lib/db/quotes';
import { readPdf } from '../../support/pdf-reader';

const machine = { kind: 'circular' as const, speedPerMinute: 60, feeders: 8, feedersPerCourse: 1, efficiency: 0.84, minuteRate: 0.4 };

/** A style quote of invented figures with `n` sizes, enough of them to run over several pages. */
function styleQuote(n: number, over: Partial<QuoteInput> = {}): StyleQuote {
  const input: QuoteInput = {
    currency: 'EUR',
    yarns: [{ id: 'pa', name: 'PA 78/68', pricePerKg: 8 }, { id: 'el', name: 'EL 44', pricePerKg: 20 }],
    wasteAllowance: 0.05,
    machine,
    makingUp: { cutting: 0.3, linking: 1.2, dyeing: 0.9, heatSetting: 0.25 },
    trims: [{ name: 'Neck label', kind: 'heat-transfer', unitCost: 0.35 }],
    targetPricePerGarment: 20,
    sizes: Array.from({ length: n }, (_, i) => ({ size: `T${i + 1}`, knittedGrams: { pa: 180 + 10 * i, el: 20 + i }, courses: 2520 + 60 * i, garments: 100 + 10 * i })),
    ...over,
  };
  const { rates, defaults } = resolveRates(null);
  return {
    styleId: '00000000-0000-4000-8000-000000000001', styleCode: 'QX-01', styleName: 'Ridge base layer', version: 1,
    inputs: quoteInputsSchema.parse({}), studio: { rates, defaults, note: exampleValueNote, mills: [] },
    machine: { ...machine, minuteRateFrom: 'studio rate' }, quote: computeQuote(input), basis: ['Invented figures.'], updatedAt: null,
  };
}

const flat = (s: string) => s.replace(/\s+/g, ' ');

describe('quotePdf (common practice, no published source)', () => {
  it('prints how the size totals, the margin and the order totals were computed', async () => {
    const q = styleQuote(2);
    const text = flat((await readPdf(quotePdf(q))).map((p) => p.text).join(' '));
    const order = q.quote.order.how;
    for (const how of [order.cost, order.revenue!, order.margin!]) expect(text).toContain(flat(how));
    expect(text).toContain('How the order totals were computed');
    for (const s of q.quote.sizes) {
      for (const how of [s.how.perGarment, s.how.margin!, s.how.orderCost, s.how.orderMargin!]) expect(text).toContain(flat(how));
      expect(text).toContain(`Margin per garment`);
      expect(text).toContain(`Order margin, size ${s.size}`);
    }
    expect(text).toMatch(/target 20\.00 − cost \d+\.\d\d = \d+\.\d\d EUR, \d+\.\d % of the target/);
  });

  it('leaves out the margin rows without a target price', async () => {
    const noTarget = styleQuote(1, { targetPricePerGarment: null });
    const text = flat((await readPdf(quotePdf(noTarget))).map((p) => p.text).join(' '));
    expect(text).toContain(flat(noTarget.quote.sizes[0]!.how.perGarment));
    expect(text).not.toContain('Margin per garment');
    expect(text).not.toContain('Order at the target price');
  });

  it('wraps long explanations and breaks pages between rows: no text outside the margins but the page number, every page headed', async () => {
    const q = styleQuote(12);
    const pages = await readPdf(quotePdf(q));
    expect(pages.length).toBeGreaterThan(2);
    // Twelve sizes summed make the order cost explanation longer than one line.
    expect(q.quote.order.how.cost.length).toBeGreaterThan(150);
    expect(flat(pages.map((p) => p.text).join(' '))).toContain(flat(q.quote.order.how.cost));
    const marginMm = 14;
    pages.forEach((p, i) => {
      expect(p.text).toContain(i === 0 ? 'Quote' : 'Quote (continued)');
      const low = p.textItems.filter((t) => t.yMm > p.heightMm - marginMm + 0.5 && !/^Page \d+ of \d+$/.test(t.str));
      expect(low, `page ${i + 1}`).toEqual([]);
      const wide = p.textItems.filter((t) => t.xMm < marginMm - 0.5 || t.rightMm > p.widthMm - marginMm + 0.5).map((t) => `${t.str} ${t.xMm.toFixed(1)}–${t.rightMm.toFixed(1)}`);
      expect(wide, `page ${i + 1}`).toEqual([]);
    });
  });
});
