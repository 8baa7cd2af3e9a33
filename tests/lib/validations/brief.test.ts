import { describe, expect, it } from 'vitest';
import { briefAnswersSchema, emptyBrief, readBriefAnswers } from '@/lib/validations/brief';

const good = briefAnswersSchema.parse({ sport: 'Trail running', targetPrice: 24.5, orderBySize: { S: 120, M: 240 }, tones: 2 });

describe('readBriefAnswers (stored answers, read by the brief and the quote alike)', () => {
  it('passes answers that meet the schema, with nothing repaired', () => {
    expect(readBriefAnswers(good)).toEqual({ answers: good, repaired: [] });
  });

  it('gives answers saved before a field existed its default, with nothing repaired', () => {
    const { markets: _m, ...older } = good;
    const read = readBriefAnswers(older);
    expect(read.answers.markets).toEqual([]);
    expect(read.repaired).toEqual([]);
  });

  it('keeps every answer that passes alone when one does not, and names the one reset', () => {
    // A tone count the schema no longer takes (at most 12) must not lose the price and the order.
    const read = readBriefAnswers({ ...good, tones: 40 });
    expect(read.answers.targetPrice).toBe(24.5);
    expect(read.answers.orderBySize).toEqual({ S: 120, M: 240 });
    expect(read.answers.sport).toBe('Trail running');
    expect(read.answers.tones).toBeNull();
    expect(read.repaired).toEqual(['tones']);
  });

  it('drops fields the schema no longer has and resets answers of the wrong type', () => {
    const read = readBriefAnswers({ ...good, oldField: 'x', targetPrice: 'cheap' });
    expect(read.answers).not.toHaveProperty('oldField');
    expect(read.answers.targetPrice).toBeNull();
    expect(read.repaired).toEqual(['targetPrice']);
    expect(briefAnswersSchema.safeParse(read.answers).success).toBe(true);
  });

  it('clears the delivery date when it comes before the sample date', () => {
    const read = readBriefAnswers({ ...good, sampleDate: '2027-05-01', deliveryDate: '2027-01-01' });
    expect(read.answers.sampleDate).toBe('2027-05-01');
    expect(read.answers.deliveryDate).toBeNull();
    expect(read.repaired).toEqual(['deliveryDate']);
  });

  it('reads something that is not an object as the empty brief', () => {
    const read = readBriefAnswers('not answers');
    expect(read.answers).toEqual(emptyBrief);
    expect(read.repaired).toEqual([]);
  });
});
