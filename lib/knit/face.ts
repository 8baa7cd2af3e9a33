/**
 * Which yarn shows on the technical face of a texture, stitch by stitch: the flat colour map a
 * colourway preview fills a zone with.
 */
import type { Texture } from './texture';

/**
 * The ground yarn seen at each cell of the repeat (`grid[course][needle]`, yarn ids). A knitted
 * loop shows the yarn of its own course; where a needle tucks or misses, its loop from an earlier
 * course is held and stays on the face (the tuck or float lies behind it), so the cell shows the
 * yarn of the last course that knitted on that needle, counting back round the repeat. A needle
 * that never knits in the repeat shows its first course's yarn. Plated yarns lie behind the ground
 * and are left out. Common practice of knit structure reading (held loops cover tucks and floats
 * on the face), no published source.
 */
export function faceYarnGrid(texture: Texture): string[][] {
  const { needles, courses, cells } = texture.repeat;
  const grid: string[][] = Array.from({ length: courses }, () => Array<string>(needles).fill(''));
  for (let n = 0; n < needles; n++) {
    for (let c = 0; c < courses; c++) {
      let shown = texture.feeders[c]?.ground ?? '';
      for (let back = 0; back < courses; back++) {
        const k = (c - back + courses) % courses;
        if (cells[k]?.[n] === 'knit') {
          shown = texture.feeders[k]?.ground ?? shown;
          break;
        }
      }
      const row = grid[c];
      if (row) row[n] = shown;
    }
  }
  return grid;
}

/** Share of the face each ground yarn covers, by yarn id (from `faceYarnGrid`); shares sum to 1. */
export function faceYarnShares(texture: Texture): Record<string, number> {
  const grid = faceYarnGrid(texture);
  const total = texture.repeat.needles * texture.repeat.courses;
  const out: Record<string, number> = {};
  for (const row of grid) for (const id of row) out[id] = (out[id] ?? 0) + 1 / total;
  return out;
}
