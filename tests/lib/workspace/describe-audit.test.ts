// The History page's wording (components/workspace/describe-audit.ts): pure, so it runs with the lib tests.
import { describe, expect, it } from 'vitest';
import { auditLines, describeAudit } from '@/components/workspace/describe-audit';

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

describe('auditLines', () => {
  const entry = (id: string, action: string, userId: string, createdAt: string) => ({ id, action, userId, createdAt });

  it('folds a run of body-map autosaves by one person into one line, newest first', () => {
    const lines = auditLines([
      entry('6', 'body-map.save', 'u1', '2026-12-02T10:31:00.000Z'),
      entry('5', 'body-map.save', 'u1', '2026-12-02T10:20:00.000Z'),
      entry('4', 'body-map.save', 'u1', '2026-12-02T10:02:00.000Z'),
      entry('3', 'style.update', 'u1', '2026-12-02T10:01:00.000Z'),
      entry('2', 'body-map.save', 'u1', '2026-12-02T09:00:00.000Z'),
    ]);
    expect(lines.map((l) => [l.latest.id, l.earliest.id, l.count])).toEqual([['6', '4', 3], ['3', '3', 1], ['2', '2', 1]]);
  });

  it('keeps apart saves by different people, saves more than 30 minutes apart, and other actions', () => {
    const lines = auditLines([
      entry('5', 'body-map.save', 'u2', '2026-12-02T10:31:00.000Z'),
      entry('4', 'body-map.save', 'u1', '2026-12-02T10:30:00.000Z'),
      entry('3', 'body-map.save', 'u1', '2026-12-02T09:59:00.000Z'),
      entry('2', 'lab-dip.submit', 'u3', '2026-12-02T09:58:00.000Z'),
      entry('1', 'lab-dip.submit', 'u3', '2026-12-02T09:57:00.000Z'),
    ]);
    expect(lines.map((l) => l.count)).toEqual([1, 1, 1, 1, 1]);
  });
});
