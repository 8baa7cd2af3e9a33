import { describe, expect, it } from 'vitest';
import { faceYarnGrid, faceYarnShares } from '@/lib/knit/face';
import type { StitchAction, Texture } from '@/lib/knit/texture';

const codes: Record<string, StitchAction> = { k: 'knit', t: 'tuck', m: 'miss' };
const texture = (rows: string[], grounds: string[]): Texture => ({
  id: 't',
  name: 't',
  repeat: { needles: rows[0]!.length, courses: rows.length, cells: rows.map((r) => [...r].map((c) => codes[c]!)) },
  feeders: grounds.map((ground) => ({ ground, plated: { yarn: 'el', draft: 2.6 } })),
  density: { walesPerCm: 20, coursesPerCm: 30 },
  loopMm: { knit: 2.4, tuck: 1.8 },
});

// Common practice, no published source: on the technical face a tuck or float lies behind the loop
// the needle holds, so the face shows the yarn of the course that last knitted on that needle.
describe('faceYarnGrid', () => {
  it('shows the ground yarn of each course in plain jersey, never the plated yarn', () => {
    expect(faceYarnGrid(texture(['kk', 'kk'], ['A', 'B']))).toEqual([
      ['A', 'A'],
      ['B', 'B'],
    ]);
  });

  it('blocks two yarns by needle in a float jacquard', () => {
    const t = texture(['kkmm', 'mmkk', 'kkmm', 'mmkk'], ['A', 'B', 'A', 'B']);
    expect(faceYarnGrid(t)).toEqual([
      ['A', 'A', 'B', 'B'],
      ['A', 'A', 'B', 'B'],
      ['A', 'A', 'B', 'B'],
      ['A', 'A', 'B', 'B'],
    ]);
    expect(faceYarnShares(t)).toEqual({ A: 0.5, B: 0.5 });
  });

  it('looks back round the repeat for a tucked needle', () => {
    expect(faceYarnGrid(texture(['kt', 'kk'], ['A', 'B']))).toEqual([
      ['A', 'B'],
      ['B', 'B'],
    ]);
  });
});
