'use client';

import { Button } from '@/components/ui/button';
import { Input } from '@/components/ui/field';

/** A force–extension point as typed: extension in %, tension in N per cm width. */
export interface CurvePointDraft {
  extensionPct: string;
  tension: string;
}

function CurvePlot({ points }: { points: { x: number; y: number }[] }) {
  const w = 300;
  const h = 130;
  const pad = { l: 32, r: 22, t: 8, b: 22 };
  const maxX = Math.max(60, ...points.map((p) => p.x));
  const maxY = Math.max(1, ...points.map((p) => p.y));
  const sx = (x: number) => pad.l + (x / maxX) * (w - pad.l - pad.r);
  const sy = (y: number) => h - pad.b - (y / maxY) * (h - pad.t - pad.b);
  const line = points.map((p, i) => `${i === 0 ? 'M' : 'L'} ${sx(p.x).toFixed(1)} ${sy(p.y).toFixed(1)}`).join(' ');
  return (
    <svg width={w} height={h} viewBox={`0 0 ${w} ${h}`} role="img" aria-label="Force–extension curve" className="text-ink-faint">
      <line x1={pad.l} x2={w - pad.r} y1={h - pad.b} y2={h - pad.b} stroke="#cbc6bb" />
      <line x1={pad.l} x2={pad.l} y1={pad.t} y2={h - pad.b} stroke="#cbc6bb" />
      {[0, 0.5, 1].map((f) => (
        <text key={f} x={pad.l - 4} y={sy(maxY * f) + 3} textAnchor="end" fontSize={9} fill="currentColor" className="figures">{(maxY * f).toFixed(1)}</text>
      ))}
      {[0, 0.5, 1].map((f) => (
        <text key={f} x={sx(maxX * f)} y={h - 6} textAnchor="middle" fontSize={9} fill="currentColor" className="figures">{(maxX * f).toFixed(0)} %</text>
      ))}
      {points.length > 1 ? <path d={line} fill="none" stroke="#3f4f8f" strokeWidth={1.75} /> : null}
      {points.map((p, i) => <circle key={i} cx={sx(p.x)} cy={sy(p.y)} r={2.75} fill="#3f4f8f" />)}
    </svg>
  );
}

/** The points of a fabric force–extension test, entered in a table, drawn beside it. */
export function ForceExtensionEditor({ points, readOnly, errors, onChange }: {
  points: readonly CurvePointDraft[];
  readOnly?: boolean;
  errors: Readonly<Record<string, string>>;
  onChange: (next: CurvePointDraft[]) => void;
}) {
  const valid = points
    .map((p) => ({ x: Number(p.extensionPct), y: Number(p.tension) }))
    .filter((p) => Number.isFinite(p.x) && Number.isFinite(p.y) && p.x > 0 && p.y >= 0);
  const set = (i: number, patch: Partial<CurvePointDraft>) => onChange(points.map((p, k) => (k === i ? { ...p, ...patch } : p)));
  return (
    <div className="flex flex-wrap items-start gap-5">
      <div className="min-w-[15rem] flex-1 space-y-2">
        {points.length === 0 ? <p className="text-sm text-ink-soft">No fabric test yet. Add the points a tensile test gave, along the girth.</p> : null}
        {points.length > 0 ? (
          <table className="w-full text-sm">
            <thead className="text-left text-xs text-ink-faint">
              <tr><th className="pb-1 font-medium">Extension %</th><th className="pb-1 font-medium">Tension N/cm</th>{readOnly ? null : <th />}</tr>
            </thead>
            <tbody>
              {points.map((p, i) => (
                <tr key={i}>
                  <td className="py-1 pr-2">
                    <Input aria-label={`Extension of point ${i + 1} in percent`} inputMode="decimal" className="figures h-8" disabled={readOnly} value={p.extensionPct} aria-invalid={!!errors[`forceExtension.${i}.extension`]} onChange={(e) => set(i, { extensionPct: e.target.value })} />
                    {errors[`forceExtension.${i}.extension`] ? <p role="alert" className="mt-0.5 text-xs text-madder-700">{errors[`forceExtension.${i}.extension`]}</p> : null}
                  </td>
                  <td className="py-1 pr-2">
                    <Input aria-label={`Tension of point ${i + 1} in newtons per cm`} inputMode="decimal" className="figures h-8" disabled={readOnly} value={p.tension} aria-invalid={!!errors[`forceExtension.${i}.tensionNPerCm`]} onChange={(e) => set(i, { tension: e.target.value })} />
                    {errors[`forceExtension.${i}.tensionNPerCm`] ? <p role="alert" className="mt-0.5 text-xs text-madder-700">{errors[`forceExtension.${i}.tensionNPerCm`]}</p> : null}
                  </td>
                  {readOnly ? null : (
                    <td className="w-8 py-1 text-right">
                      <Button type="button" size="sm" variant="ghost" aria-label={`Remove point ${i + 1}`} onClick={() => onChange(points.filter((_, k) => k !== i))}>×</Button>
                    </td>
                  )}
                </tr>
              ))}
            </tbody>
          </table>
        ) : null}
        {errors.forceExtension ? <p role="alert" className="text-xs text-madder-700">{errors.forceExtension}</p> : null}
        {readOnly ? null : (
          <Button type="button" size="sm" onClick={() => {
            const last = points[points.length - 1];
            onChange([...points, { extensionPct: last ? String(Number(last.extensionPct || 0) + 10) : '10', tension: '' }]);
          }}>
            Add point
          </Button>
        )}
      </div>
      {valid.length > 0 ? <CurvePlot points={valid} /> : null}
    </div>
  );
}
