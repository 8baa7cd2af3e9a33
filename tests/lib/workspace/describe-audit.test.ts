// The History page's wording (components/workspace/describe-audit.ts): pure, so it runs with the lib tests.
import { describe, expect, it } from 'vitest';
import { describeAudit } from '@/components/workspace/describe-audit';

describe('describeAudit for the brief and the quote', () => {
  it('lists the brief fields saved, in plain words, never the raw action code', () => {
    const line = describeAudit('brief.save', { fields: ['sport', 'targetPrice', 'orderBySize'] });
    expect(line).toBe('Saved the brief: sport, target price, order by size');
    expect(describeAudit('brief.save', { fields: [] })).toBe('Saved the brief: no fields');
    expect(describeAudit('brief.save', {})).toBe('Saved the brief');
  });

  it('words every reference-board entry', () => {
    expect(describeAudit('brief.reference.add', { name: 'rib.png', tag: 'detail', caption: 'Rib' })).toBe('Added a reference image rib.png (detail)');
    expect(describeAudit('brief.reference.edit', { fields: ['caption', 'tag'] })).toBe('Edited a reference image: caption, tag');
    expect(describeAudit('brief.reference.reorder', { count: 3 })).toBe('Rearranged the reference board (3 images)');
    expect(describeAudit('brief.reference.reorder', { count: 1 })).toBe('Rearranged the reference board (1 image)');
    expect(describeAudit('brief.reference.remove', { name: 'rib.png' })).toBe('Removed a reference image rib.png');
  });

  it('lists the quote entries saved, and the studio rates changed', () => {
    expect(describeAudit('quote.save', { fields: ['feedersPerCourse', 'makingUp'] })).toBe('Saved the quote entries: feeders per course, making up');
    expect(describeAudit('quote.save', {})).toBe('Saved the quote entries');
    expect(describeAudit('studio.costing', { fields: ['machineMinuteRate'] })).toBe('Changed the studio costing rates: machine minute rate');
  });

  it('no brief or quote action falls through to its code', () => {
    for (const action of ['brief.save', 'brief.reference.add', 'brief.reference.edit', 'brief.reference.reorder', 'brief.reference.remove', 'quote.save']) {
      expect(describeAudit(action, {})).not.toContain(action);
    }
  });
});
