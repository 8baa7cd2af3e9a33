/**
 * A test knit against the plan: the deviation of each measured figure from the planned one, in %,
 * and whether any passes the studio's threshold (default 5 %: common practice, no published
 * source — mills and studios commonly accept about ±5 % on density and weight before a structure
 * is re-set).
 */

export const defaultTestKnitThresholdPct = 5;

export interface TestKnitFigures {
  walesPerCm: number;
  coursesPerCm: number;
  /** g/m²; null when not planned or not measured. */
  gsm: number | null;
}

export interface FigureDeviation {
  figure: 'walesPerCm' | 'coursesPerCm' | 'gsm';
  label: string;
  planned: number;
  measured: number;
  /** (measured − planned) ÷ planned × 100. */
  percent: number;
  flagged: boolean;
}

export interface TestKnitDeviation {
  figures: FigureDeviation[];
  flagged: boolean;
  thresholdPct: number;
}

const labels = { walesPerCm: 'wales/cm', coursesPerCm: 'courses/cm', gsm: 'g/m²' } as const;

/** Deviation in %: (measured − planned) ÷ planned × 100. */
export function deviationPercent(planned: number, measured: number): number {
  if (!(planned > 0)) throw new RangeError(`A planned figure must be positive (got ${planned}).`);
  return ((measured - planned) / planned) * 100;
}

/**
 * Compares measured with planned figures; a figure is flagged when |deviation| is more than the
 * threshold (exactly at the threshold is within it). g/m² is compared only when both are known.
 */
export function testKnitDeviation(planned: TestKnitFigures, measured: TestKnitFigures, thresholdPct = defaultTestKnitThresholdPct): TestKnitDeviation {
  if (!(thresholdPct >= 0)) throw new RangeError(`The threshold must be a percentage ≥ 0 (got ${thresholdPct}).`);
  const figures: FigureDeviation[] = [];
  for (const key of ['walesPerCm', 'coursesPerCm', 'gsm'] as const) {
    const p = planned[key];
    const m = measured[key];
    if (p === null || m === null || !(p > 0)) continue;
    const percent = deviationPercent(p, m);
    figures.push({ figure: key, label: labels[key], planned: p, measured: m, percent, flagged: Math.abs(percent) > thresholdPct + 1e-9 });
  }
  return { figures, flagged: figures.some((f) => f.flagged), thresholdPct };
}
