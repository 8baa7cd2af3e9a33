import type { StitchAction } from '@/lib/knit/texture';
import { actionStyle } from './stitch-symbols';

/**
 * A small picture of a stitch chart: one square per cell in its action's mark colour, course 1 at
 * the bottom, the repeat drawn twice across and up so its rhythm shows.
 */
export function ChartThumbnail({ cells, size = 44 }: { cells: readonly (readonly StitchAction[])[]; size?: number }) {
  const courses = cells.length;
  const needles = cells[0]?.length ?? 0;
  if (courses === 0 || needles === 0) return null;
  const reps = Math.max(1, Math.min(4, Math.floor(16 / Math.max(needles, courses))));
  const w = needles * reps;
  const h = courses * reps;
  const cell = size / Math.max(w, h);
  const colour: Record<StitchAction, string> = { knit: '#4a5157', tuck: '#b7831f', miss: actionStyle.miss.fill };
  const rects: React.ReactNode[] = [];
  for (let r = 0; r < h; r++) {
    const row = cells[(h - 1 - r) % courses] ?? [];
    for (let n = 0; n < w; n++) {
      const a = row[n % needles] ?? 'knit';
      rects.push(<rect key={`${r}-${n}`} x={n * cell} y={r * cell} width={cell} height={cell} fill={colour[a]} />);
    }
  }
  return (
    <svg width={w * cell} height={h * cell} viewBox={`0 0 ${w * cell} ${h * cell}`} aria-hidden shapeRendering="crispEdges" className="rounded-sm ring-1 ring-rule">
      {rects}
    </svg>
  );
}
