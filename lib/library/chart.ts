/**
 * Stitch-chart editing: pure operations on a texture's repeat and its feeders, used by the chart
 * editor and by the data layer to store the chart compactly.
 *
 * Coordinates follow lib/knit/texture.ts: `cells[course][needle]`, course 0 knitted first. Every
 * operation returns a new chart and leaves its input untouched.
 */
import { stitchActions, type Feeder, type StitchAction } from '@/lib/knit/texture';

/** The stored letter of each action: one character per needle, one string per course. */
export const actionLetters: Readonly<Record<StitchAction, 'k' | 't' | 'm'>> = { knit: 'k', tuck: 't', miss: 'm' };
const lettersToAction: Readonly<Record<string, StitchAction>> = { k: 'knit', t: 'tuck', m: 'miss' };

export function isStitchAction(v: unknown): v is StitchAction {
  return typeof v === 'string' && (stitchActions as readonly string[]).includes(v);
}

/** One course as its compact string, e.g. ['knit', 'tuck'] → "kt". */
export function encodeCourse(row: readonly StitchAction[]): string {
  return row.map((a) => actionLetters[a]).join('');
}

/** A compact course string back to actions; undefined when a letter is not k, t or m. */
export function decodeCourse(text: string): StitchAction[] | undefined {
  const out: StitchAction[] = [];
  for (const ch of text.toLowerCase()) {
    const a = lettersToAction[ch];
    if (!a) return undefined;
    out.push(a);
  }
  return out;
}

export function encodeCells(cells: readonly (readonly StitchAction[])[]): string[] {
  return cells.map(encodeCourse);
}

/** @throws RangeError when a course holds a letter other than k, t, m. */
export function decodeCells(rows: readonly string[]): StitchAction[][] {
  return rows.map((r, c) => {
    const row = decodeCourse(r);
    if (!row) throw new RangeError(`Course ${c + 1} of the chart holds a letter other than k, t or m.`);
    return row;
  });
}

/**
 * What the chart editor edits: the repeat's cells and what each course is knitted with (its
 * feeder, or in the editor the index of a feeder set).
 */
export interface Chart<F = Feeder> {
  cells: StitchAction[][];
  feeders: F[];
}

export const chartLimits = { maxNeedles: 96, maxCourses: 96 } as const;

const copy = <F>(f: F): F => (typeof f === 'object' && f !== null ? structuredClone(f) : f);
const cloneFeeder = (f: Feeder): Feeder => (f.plated ? { ground: f.ground, plated: { ...f.plated } } : { ground: f.ground });

/** A chart of `needles` × `courses`, every cell `action`, every course on `feeder`. */
export function blankChart<F>(needles: number, courses: number, feeder: F, action: StitchAction = 'knit'): Chart<F> {
  return {
    cells: Array.from({ length: courses }, () => Array.from({ length: needles }, () => action)),
    feeders: Array.from({ length: courses }, () => copy(feeder)),
  };
}

export function chartSize<F>(chart: Chart<F>): { needles: number; courses: number } {
  return { needles: chart.cells[0]?.length ?? 0, courses: chart.cells.length };
}

/** Sets one cell; returns the same chart when nothing changes (so a drag over a painted cell is free). */
export function paintCell<F>(chart: Chart<F>, course: number, needle: number, action: StitchAction): Chart<F> {
  const row = chart.cells[course];
  if (!row || needle < 0 || needle >= row.length || row[needle] === action) return chart;
  const cells = chart.cells.slice();
  const next = row.slice();
  next[needle] = action;
  cells[course] = next;
  return { ...chart, cells };
}

/** Every needle of one course set to `action`. */
export function fillCourse<F>(chart: Chart<F>, course: number, action: StitchAction): Chart<F> {
  const row = chart.cells[course];
  if (!row) return chart;
  const cells = chart.cells.slice();
  cells[course] = row.map(() => action);
  return { ...chart, cells };
}

/** One needle set to `action` in every course. */
export function fillNeedle<F>(chart: Chart<F>, needle: number, action: StitchAction): Chart<F> {
  return { ...chart, cells: chart.cells.map((row) => row.map((a, n) => (n === needle ? action : a))) };
}

export type ShiftDirection = 'left' | 'right' | 'up' | 'down';

const rotate = <T>(list: readonly T[], by: number): T[] => {
  const n = list.length;
  if (n === 0) return [];
  const k = ((by % n) + n) % n;
  return [...list.slice(n - k), ...list.slice(0, n - k)];
};

/**
 * Shifts the repeat by one stitch, wrapping around (the repeat tiles, so nothing is lost).
 * Right moves every needle to the next one; up moves every course one later in knitting order
 * (up the chart, course 1 at the bottom). A course keeps its feeder when it moves.
 */
export function shiftChart<F>(chart: Chart<F>, direction: ShiftDirection): Chart<F> {
  switch (direction) {
    case 'left':
      return { ...chart, cells: chart.cells.map((row) => rotate(row, -1)) };
    case 'right':
      return { ...chart, cells: chart.cells.map((row) => rotate(row, 1)) };
    case 'up':
      return { cells: rotate(chart.cells, 1), feeders: rotate(chart.feeders, 1) };
    case 'down':
      return { cells: rotate(chart.cells, -1), feeders: rotate(chart.feeders, -1) };
  }
}

/**
 * Resizes the repeat keeping its content: existing cells stay where they are (needle 1, course 1
 * anchored), cut ones are dropped, new cells knit, new courses take the feeder of the last course.
 * @throws RangeError for sizes outside 1 … chartLimits.
 */
export function resizeChart<F>(chart: Chart<F>, needles: number, courses: number): Chart<F> {
  if (!Number.isInteger(needles) || needles < 1 || needles > chartLimits.maxNeedles) {
    throw new RangeError(`A repeat is 1 to ${chartLimits.maxNeedles} needles wide.`);
  }
  if (!Number.isInteger(courses) || courses < 1 || courses > chartLimits.maxCourses) {
    throw new RangeError(`A repeat is 1 to ${chartLimits.maxCourses} courses high.`);
  }
  const lastFeeder = chart.feeders[chart.feeders.length - 1];
  if (lastFeeder === undefined) throw new RangeError('A chart has at least one course.');
  const cells: StitchAction[][] = [];
  const feeders: F[] = [];
  for (let c = 0; c < courses; c++) {
    const row = chart.cells[c] ?? [];
    cells.push(Array.from({ length: needles }, (_, n) => row[n] ?? 'knit'));
    feeders.push(copy(chart.feeders[c] ?? lastFeeder));
  }
  return { cells, feeders };
}

/** Sets the feeder of one course. */
export function setCourseFeeder<F>(chart: Chart<F>, course: number, feeder: F): Chart<F> {
  if (course < 0 || course >= chart.feeders.length) return chart;
  const feeders = chart.feeders.slice();
  feeders[course] = copy(feeder);
  return { ...chart, feeders };
}

/** How many cells of each action the repeat holds. */
export function countActions(cells: readonly (readonly StitchAction[])[]): Record<StitchAction, number> {
  const out: Record<StitchAction, number> = { knit: 0, tuck: 0, miss: 0 };
  for (const row of cells) for (const a of row) out[a]++;
  return out;
}

/** Same feeder: same ground, and the same plated yarn at the same draft (or none). */
export function sameFeeder(a: Feeder, b: Feeder): boolean {
  if (a.ground !== b.ground) return false;
  if (!a.plated || !b.plated) return !a.plated && !b.plated;
  return a.plated.yarn === b.plated.yarn && a.plated.draft === b.plated.draft;
}

/**
 * The distinct feeder sets of a chart in order of first use, and which set each course uses.
 * The editor shows sets as A, B, C… and lets the designer pick one per course.
 */
export function feederSets(feeders: readonly Feeder[]): { sets: Feeder[]; courseSet: number[] } {
  const sets: Feeder[] = [];
  const courseSet = feeders.map((f) => {
    const i = sets.findIndex((s) => sameFeeder(s, f));
    if (i >= 0) return i;
    sets.push(cloneFeeder(f));
    return sets.length - 1;
  });
  return { sets, courseSet };
}

/** Letter of a feeder set: 0 → A, 1 → B … */
export function feederSetLetter(index: number): string {
  return String.fromCharCode(65 + (index % 26));
}
