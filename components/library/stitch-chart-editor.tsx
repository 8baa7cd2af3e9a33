'use client';

import { useEffect, useRef, useState } from 'react';
import { stitchActions, type StitchAction } from '@/lib/knit/texture';
import {
  chartLimits, chartSize, countActions, fillCourse, fillNeedle, paintCell, resizeChart, setCourseFeeder, shiftChart,
  type Chart, type ShiftDirection,
} from '@/lib/library/chart';
import { Button } from '@/components/ui/button';
import { Input } from '@/components/ui/field';
import { actionStyle, StitchSymbol, SymbolSwatch } from './stitch-symbols';

/** How a feeder set shows beside the chart. */
export interface FeederSetView {
  letter: string;
  colour: string;
  label: string;
}

export interface StitchChartEditorProps {
  /** Cells and, per course, the index of its feeder set. */
  chart: Chart<number>;
  sets: readonly FeederSetView[];
  readOnly?: boolean;
  /** `mark` starts a new undo step; a drag sends one marked change and then unmarked ones. */
  onChange: (next: Chart<number>, opts: { mark: boolean }) => void;
  onUndo?: () => void;
  onRedo?: () => void;
  canUndo?: boolean;
  canRedo?: boolean;
}

const shifts: { dir: ShiftDirection; label: string; glyph: string }[] = [
  { dir: 'left', label: 'Shift the repeat left', glyph: '←' },
  { dir: 'right', label: 'Shift the repeat right', glyph: '→' },
  { dir: 'down', label: 'Shift the repeat down', glyph: '↓' },
  { dir: 'up', label: 'Shift the repeat up', glyph: '↑' },
];

const isTyping = (el: EventTarget | null) =>
  el instanceof HTMLElement && (el.isContentEditable || ['INPUT', 'SELECT', 'TEXTAREA'].includes(el.tagName));

/** Repeat size inputs; a fresh form whenever the chart's size changes (undo, shift, resize). */
function ResizeForm({ needles, courses, onResize }: { needles: number; courses: number; onResize: (needles: number, courses: number) => void }) {
  const [size, setSize] = useState({ needles: String(needles), courses: String(courses) });
  const [error, setError] = useState<string | null>(null);
  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    const n = Number(size.needles);
    const c = Number(size.courses);
    if (!Number.isInteger(n) || n < 1 || n > chartLimits.maxNeedles || !Number.isInteger(c) || c < 1 || c > chartLimits.maxCourses) {
      setError(`A repeat is 1–${chartLimits.maxNeedles} needles by 1–${chartLimits.maxCourses} courses.`);
      return;
    }
    setError(null);
    onResize(n, c);
  };
  return (
    <form className="ml-auto flex flex-wrap items-center gap-1.5" onSubmit={submit}>
      <span className="text-xs text-ink-faint">Repeat</span>
      <Input aria-label="Repeat width in needles" inputMode="numeric" className="figures h-7 w-14 px-1.5 text-center" value={size.needles} onChange={(e) => setSize((s) => ({ ...s, needles: e.target.value }))} />
      <span className="text-xs text-ink-faint">×</span>
      <Input aria-label="Repeat height in courses" inputMode="numeric" className="figures h-7 w-14 px-1.5 text-center" value={size.courses} onChange={(e) => setSize((s) => ({ ...s, courses: e.target.value }))} />
      <Button type="submit" size="sm" disabled={size.needles === String(needles) && size.courses === String(courses)}>Resize</Button>
      {error ? <p role="alert" className="w-full text-right text-xs text-madder-700">{error}</p> : null}
    </form>
  );
}

/**
 * The stitch-chart grid editor: W needles × H courses drawn with Needlemap's own symbols, course 1
 * at the bottom. Click or drag to paint the chosen stitch; click a course or needle number to fill
 * it; shift the repeat with wrap-around; resize keeping the content; pick each course's feeder set.
 */
export function StitchChartEditor({ chart, sets, readOnly = false, onChange, onUndo, onRedo, canUndo, canRedo }: StitchChartEditorProps) {
  const { needles, courses } = chartSize(chart);
  const [tool, setTool] = useState<StitchAction>('knit');
  const chartRef = useRef(chart);
  const gesture = useRef<{ marked: boolean } | null>(null);
  const svgRef = useRef<SVGSVGElement>(null);

  useEffect(() => {
    chartRef.current = chart;
  }, [chart]);

  const change = (next: Chart<number>, mark: boolean) => {
    if (next === chartRef.current) return;
    chartRef.current = next;
    onChange(next, { mark });
  };

  useEffect(() => {
    if (readOnly) return;
    const onKey = (e: KeyboardEvent) => {
      if (isTyping(e.target)) return;
      const k = e.key.toLowerCase();
      if ((e.ctrlKey || e.metaKey) && k === 'z') {
        e.preventDefault();
        if (e.shiftKey) onRedo?.();
        else onUndo?.();
      } else if ((e.ctrlKey || e.metaKey) && k === 'y') {
        e.preventDefault();
        onRedo?.();
      } else if (!e.ctrlKey && !e.metaKey && !e.altKey) {
        const a = stitchActions.find((s) => actionStyle[s].key.toLowerCase() === k);
        if (a) setTool(a);
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [readOnly, onUndo, onRedo]);

  const cell = Math.max(14, Math.min(40, Math.floor(Math.min(640 / needles, 560 / courses))));
  const width = needles * cell;
  const height = courses * cell;
  const labelFont = cell < 18 ? 'text-[9px]' : 'text-2xs';

  const cellAt = (e: React.PointerEvent): { course: number; needle: number } | null => {
    const r = svgRef.current?.getBoundingClientRect();
    if (!r) return null;
    const needle = Math.floor(((e.clientX - r.left) / r.width) * needles);
    const row = Math.floor(((e.clientY - r.top) / r.height) * courses);
    if (needle < 0 || needle >= needles || row < 0 || row >= courses) return null;
    return { course: courses - 1 - row, needle };
  };

  const paintAt = (e: React.PointerEvent) => {
    const at = cellAt(e);
    if (!at || !gesture.current) return;
    const next = paintCell(chartRef.current, at.course, at.needle, tool);
    if (next === chartRef.current) return;
    change(next, !gesture.current.marked);
    gesture.current.marked = true;
  };

  const onPointerDown = (e: React.PointerEvent<SVGSVGElement>) => {
    if (readOnly || e.button !== 0) return;
    e.preventDefault();
    svgRef.current?.setPointerCapture(e.pointerId);
    gesture.current = { marked: false };
    paintAt(e);
  };
  const endGesture = () => {
    gesture.current = null;
  };


  const counts = countActions(chart.cells);
  const total = needles * courses;
  const rows: React.ReactNode[] = [];
  for (let row = 0; row < courses; row++) {
    const course = courses - 1 - row;
    const line = chart.cells[course] ?? [];
    for (let n = 0; n < needles; n++) {
      const a = line[n] ?? 'knit';
      rows.push(
        <g key={`${course}-${n}`} data-course={course} data-needle={n} data-action={a}>
          <rect x={n * cell} y={row * cell} width={cell} height={cell} fill={actionStyle[a].fill} />
          <StitchSymbol action={a} x={n * cell} y={row * cell} size={cell} />
        </g>,
      );
    }
  }
  const gridLines: React.ReactNode[] = [];
  for (let n = 0; n <= needles; n++) {
    const strong = n === 0 || n === needles || (needles > 8 && n % 4 === 0);
    gridLines.push(<line key={`v${n}`} x1={n * cell} x2={n * cell} y1={0} y2={height} stroke={strong ? '#cbc6bb' : '#e2dfd7'} strokeWidth={1} />);
  }
  for (let r = 0; r <= courses; r++) {
    const strong = r === 0 || r === courses || (courses > 8 && (courses - r) % 4 === 0);
    gridLines.push(<line key={`h${r}`} x1={0} x2={width} y1={r * cell} y2={r * cell} stroke={strong ? '#cbc6bb' : '#e2dfd7'} strokeWidth={1} />);
  }

  return (
    <div className="space-y-3">
      {readOnly ? null : (
        <div className="flex flex-wrap items-center gap-x-4 gap-y-2" role="toolbar" aria-label="Chart tools">
          <div role="radiogroup" aria-label="Stitch to paint" className="inline-flex rounded-md border border-rule-strong bg-paper p-0.5">
            {stitchActions.map((a) => (
              <button
                key={a}
                type="button"
                role="radio"
                aria-checked={tool === a}
                title={`${actionStyle[a].label} (${actionStyle[a].key})`}
                onClick={() => setTool(a)}
                className={`inline-flex items-center gap-1.5 rounded px-2.5 py-1 text-sm font-medium ${tool === a ? 'bg-panel text-ink shadow-sm ring-1 ring-rule' : 'text-ink-soft hover:text-ink'}`}
              >
                <SymbolSwatch action={a} size={16} />
                {actionStyle[a].label}
                <kbd className="figures text-2xs text-ink-faint">{actionStyle[a].key}</kbd>
              </button>
            ))}
          </div>
          <div className="flex items-center gap-1" aria-label="Shift the repeat">
            <span className="mr-1 text-xs text-ink-faint">Shift</span>
            {shifts.map((s) => (
              <Button key={s.dir} type="button" size="sm" variant="secondary" aria-label={s.label} title={s.label} onClick={() => change(shiftChart(chartRef.current, s.dir), true)}>
                <span aria-hidden className="figures">{s.glyph}</span>
              </Button>
            ))}
          </div>
          <div className="flex items-center gap-1">
            <Button type="button" size="sm" variant="ghost" disabled={!canUndo} onClick={onUndo} title="Undo (Ctrl+Z)">Undo</Button>
            <Button type="button" size="sm" variant="ghost" disabled={!canRedo} onClick={onRedo} title="Redo (Ctrl+Shift+Z)">Redo</Button>
          </div>
          <ResizeForm key={`${needles}x${courses}`} needles={needles} courses={courses} onResize={(n, c) => change(resizeChart(chartRef.current, n, c), true)} />
        </div>
      )}

      <div className="flex flex-wrap items-start gap-5">
        <div className="max-w-full overflow-auto rounded-md border border-rule bg-paper/60 p-4">
          <div className="inline-grid gap-x-2 gap-y-1.5" style={{ gridTemplateColumns: 'auto auto auto' }}>
            {/* Course numbers: click to fill the course. */}
            <div className="flex flex-col" aria-label="Courses">
              {Array.from({ length: courses }, (_, row) => {
                const course = courses - 1 - row;
                return (
                  <button
                    key={course}
                    type="button"
                    disabled={readOnly}
                    onClick={() => change(fillCourse(chartRef.current, course, tool), true)}
                    aria-label={`Fill course ${course + 1} with ${actionStyle[tool].label.toLowerCase()}`}
                    title={readOnly ? `Course ${course + 1}` : `Fill course ${course + 1} with ${actionStyle[tool].label.toLowerCase()}`}
                    className={`figures flex items-center justify-end rounded-sm pr-1 ${labelFont} text-ink-faint enabled:hover:bg-spruce-50 enabled:hover:text-spruce-700`}
                    style={{ height: cell, minWidth: 22 }}
                  >
                    {course + 1}
                  </button>
                );
              })}
            </div>
            <svg
              ref={svgRef}
              width={width}
              height={height}
              viewBox={`0 0 ${width} ${height}`}
              role="img"
              aria-label={`Stitch chart, ${needles} needles by ${courses} courses`}
              data-testid="stitch-chart"
              className={`block touch-none select-none bg-panel ${readOnly ? '' : 'cursor-crosshair'}`}
              onPointerDown={onPointerDown}
              onPointerMove={(e) => gesture.current && paintAt(e)}
              onPointerUp={endGesture}
              onPointerCancel={endGesture}
              onLostPointerCapture={endGesture}
            >
              {rows}
              {gridLines}
            </svg>
            {/* Feeder set of each course. */}
            <div className="flex flex-col" aria-label="Feeders">
              {Array.from({ length: courses }, (_, row) => {
                const course = courses - 1 - row;
                const setIndex = chart.feeders[course] ?? 0;
                const set = sets[setIndex];
                return (
                  <div key={course} className="flex items-center gap-1" style={{ height: cell }}>
                    <span aria-hidden className="h-[70%] w-1 rounded-full" style={{ background: set?.colour ?? '#cbc6bb' }} />
                    <select
                      aria-label={`Feeder of course ${course + 1}`}
                      title={set?.label}
                      disabled={readOnly}
                      value={setIndex}
                      onChange={(e) => change(setCourseFeeder(chartRef.current, course, Number(e.target.value)), true)}
                      className={`figures rounded border border-transparent bg-transparent px-0.5 font-semibold text-ink-soft hover:border-rule-strong focus:border-spruce-500 focus:outline-none ${cell < 20 ? 'text-[10px]' : 'text-xs'}`}
                      style={{ height: Math.min(cell, 24) }}
                    >
                      {sets.map((s, i) => <option key={i} value={i}>{s.letter}</option>)}
                    </select>
                  </div>
                );
              })}
            </div>
            <div />
            {/* Needle numbers: click to fill the needle in every course. */}
            <div className="flex" aria-label="Needles">
              {Array.from({ length: needles }, (_, n) => (
                <button
                  key={n}
                  type="button"
                  disabled={readOnly}
                  onClick={() => change(fillNeedle(chartRef.current, n, tool), true)}
                  aria-label={`Fill needle ${n + 1} with ${actionStyle[tool].label.toLowerCase()}`}
                  title={readOnly ? `Needle ${n + 1}` : `Fill needle ${n + 1} with ${actionStyle[tool].label.toLowerCase()}`}
                  className={`figures flex justify-center rounded-sm pt-0.5 ${labelFont} text-ink-faint enabled:hover:bg-spruce-50 enabled:hover:text-spruce-700`}
                  style={{ width: cell }}
                >
                  {needles > 24 && (n + 1) % 4 !== 0 && n !== 0 ? '' : n + 1}
                </button>
              ))}
            </div>
            <div />
          </div>
        </div>

        <div className="min-w-[14rem] flex-1 space-y-4 text-xs text-ink-soft">
          <div>
            <h3 className="mb-1.5 font-semibold uppercase tracking-[0.08em] text-ink-faint">Legend</h3>
            <ul className="space-y-1.5" aria-label="Legend">
              {stitchActions.map((a) => (
                <li key={a} className="flex items-center gap-2">
                  <SymbolSwatch action={a} />
                  <span className="w-10 font-medium text-ink">{actionStyle[a].label}</span>
                  <span className="figures text-ink-faint">{counts[a]} of {total}</span>
                </li>
              ))}
            </ul>
          </div>
          <div>
            <h3 className="mb-1.5 font-semibold uppercase tracking-[0.08em] text-ink-faint">Feeder sets</h3>
            <ul className="space-y-1.5">
              {sets.map((s) => (
                <li key={s.letter} className="flex items-start gap-2">
                  <span aria-hidden className="mt-0.5 h-3.5 w-1 shrink-0 rounded-full" style={{ background: s.colour }} />
                  <span className="figures w-3 font-semibold text-ink">{s.letter}</span>
                  <span>{s.label}</span>
                </li>
              ))}
            </ul>
          </div>
          {readOnly ? null : (
            <p className="leading-relaxed text-ink-faint">
              Click or drag to paint. Click a course or needle number to fill it with the chosen stitch. Keys: K, T, M pick the stitch; Ctrl+Z undoes.
            </p>
          )}
        </div>
      </div>
    </div>
  );
}
