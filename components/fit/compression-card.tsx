'use client';

import type { SizeCompression } from '@/lib/fit/fit-sheet';
import type { BandStatus, CompressionTarget } from '@/lib/fit/compression-target';
import { girthLabels, pointsOfMeasure } from '@/lib/fit/points';
import type { LengthUnit } from '@/lib/fit/units';
import type { FitTexture } from '@/lib/db/fit';
import { Card, Notice } from '@/components/ui/card';
import { CompressionCaution } from './caution';
import { len } from './format';

const statusText: Record<BandStatus, string> = { slack: 'slack', below: 'too loose', within: 'in band', above: 'too tight' };
const statusTone: Record<BandStatus, string> = {
  slack: 'bg-ochre-50 text-ochre-700',
  below: 'bg-ochre-50 text-ochre-700',
  within: 'bg-spruce-50 text-spruce-700',
  above: 'bg-madder-50 text-madder-700',
};
const barFill: Record<BandStatus, string> = {
  slack: 'var(--color-ochre-500)', below: 'var(--color-ochre-500)', within: 'var(--color-spruce-600)', above: 'var(--color-madder-500)',
};

/** Pressure per girth of one size against the target band, drawn as SVG. */
function PressureChart({ size, rows, band, scaleMax }: { size: string; rows: SizeCompression['girths']; band: { minMmHg: number; maxMmHg: number }; scaleMax: number }) {
  // Drawn at about its on-screen size so the type stays small.
  const w = 440;
  const left = 48;
  const right = 34;
  const rowH = 15;
  const top = 4;
  const plotH = rows.length * rowH;
  const h = top + plotH + 16;
  const x = (mmHg: number) => left + (Math.min(mmHg, scaleMax) / scaleMax) * (w - left - right);
  const ticks = Array.from({ length: Math.floor(scaleMax / 5) + 1 }, (_, i) => i * 5);
  return (
    <svg viewBox={`0 0 ${w} ${h}`} className="mt-1 w-full" role="img" aria-label={`Estimated pressure per girth, size ${size}, against the target band ${band.minMmHg}–${band.maxMmHg} mmHg`}>
      <rect x={x(band.minMmHg)} y={top} width={x(band.maxMmHg) - x(band.minMmHg)} height={plotH} fill="var(--color-spruce-100)" opacity={0.8} />
      {ticks.map((t) => (
        <g key={t}>
          <line x1={x(t)} x2={x(t)} y1={top} y2={top + plotH + (t % 10 === 0 ? 3 : 1.5)} stroke="var(--color-rule-strong)" strokeWidth={t % 10 === 0 ? 0.8 : 0.4} />
          {t % 10 === 0 ? <text x={x(t)} y={h - 2} textAnchor="middle" fontSize={9} fill="var(--color-ink-faint)" fontFamily="var(--font-figures)">{t}</text> : null}
        </g>
      ))}
      <text x={left - 6} y={h - 2} textAnchor="end" fontSize={9} fill="var(--color-ink-faint)">mmHg</text>
      {rows.map((g, i) => {
        const y = top + i * rowH;
        const p = g.estimate.pressureMmHg;
        return (
          <g key={g.girth}>
            <text x={left - 6} y={y + 10.5} textAnchor="end" fontSize={10} fill="var(--color-ink-soft)">{girthLabels[g.girth]}</text>
            <rect x={left} y={y + 3.5} width={Math.max(1, x(p) - left)} height={8} rx={1} fill={barFill[g.status]} opacity={g.estimate.extrapolated ? 0.5 : 1} />
            <text x={Math.min(x(p), w - right) + 4} y={y + 10.5} fontSize={9} fill="var(--color-ink)" fontFamily="var(--font-figures)">{p.toFixed(1)}{p > scaleMax ? ' ▸' : ''}</text>
          </g>
        );
      })}
    </svg>
  );
}

/** A finding in the display unit (the lib's own sentences are in cm). */
function findingText(size: string, g: SizeCompression['girths'][number], target: CompressionTarget, unit: LengthUnit) {
  const f = g.finding!;
  if (unit === 'cm') return { message: f.message, advice: f.advice };
  const band = target.bands[target.level];
  const bandText = `the ${target.level} band (${band.minMmHg.toFixed(1)}–${band.maxMmHg.toFixed(1)} mmHg)`;
  const where = `Size ${size}, ${girthLabels[g.girth].toLowerCase()} ${len(g.bodyGirthCm, unit)} in`;
  const message = g.status === 'slack'
    ? `${where}: the garment is not stretched (relaxed girth ${len(g.garmentGirthCm, unit)} in), so it gives no compression — below ${bandText}.`
    : `${where}: about ${g.estimate.pressureMmHg.toFixed(1)} mmHg, ${g.status === 'below' ? 'too loose for' : 'too tight for'} ${bandText}.`;
  if (f.changeCm === null || f.targetHalfWidthCm === null) return { message, advice: f.advice };
  const point = pointsOfMeasure[g.point].label.toLowerCase();
  let advice = `${f.changeCm < 0 ? 'Reduce' : 'Increase'} the ${point} of size ${size} by ${len(Math.abs(f.changeCm), unit)} in, to ${len(f.targetHalfWidthCm, unit)} in (the middle of the band).`;
  if (f.rangeCm) advice += ` Anything from ${len(f.rangeCm.fromCm, unit)} to ${len(f.rangeCm.toCm, unit)} in stays inside it.`;
  return { message, advice };
}

/** The compression estimate per size: a table and a chart each, the findings with their advice, the caution beside all of it. */
export function CompressionCard({
  rows, target, texture, unit,
}: {
  rows: SizeCompression[] | null;
  target: CompressionTarget;
  texture: FitTexture | null;
  unit: LengthUnit;
}) {
  const band = target.bands[target.level];
  const title = (
    <span className="flex flex-wrap items-baseline gap-x-3">
      Compression estimate
      <span className="figures text-xs font-normal text-ink-soft">
        {texture ? `${texture.name} · ` : ''}target {target.level} {band.minMmHg}–{band.maxMmHg} mmHg
      </span>
    </span>
  );
  if (!rows || !texture) {
    return (
      <Card title={title}>
        <Notice tone="warn">Choose a compression texture with a force–extension test in Fit settings to estimate the pressure.</Notice>
      </Card>
    );
  }
  const findings = rows.flatMap((r) => r.girths.filter((g) => g.finding).map((g) => ({ size: r.size, g })));
  const maxP = Math.max(0, ...rows.flatMap((r) => r.girths.map((g) => g.estimate.pressureMmHg)));
  const scaleMax = Math.max(30, Math.ceil(Math.max(maxP, band.maxMmHg) / 10) * 10);
  return (
    <Card title={title}>
      <div className="grid grid-cols-1 gap-3 md:grid-cols-2 2xl:grid-cols-3">
        {rows.map((r) => {
          const cautionId = `caution-${r.size}`;
          return (
            <section key={r.size} className="rounded-md border border-rule p-2.5" data-testid={`compression-${r.size}`} aria-label={`Compression, size ${r.size}`}>
              <header className="mb-1.5 flex items-center justify-between">
                <span className="figures rounded bg-ink px-1.5 py-0.5 text-xs font-semibold text-white">{r.size}</span>
                <span className="text-2xs text-ink-faint">{r.girths.filter((g) => g.status === 'within').length} of {r.girths.length} girths in band</span>
              </header>
              {r.girths.length ? (
                <>
                  <table className="w-full text-xs">
                    <thead className="text-ink-faint">
                      <tr>
                        <th className="py-0.5 text-left font-normal">Girth</th>
                        <th className="text-right font-normal" title={`Body girth, ${unit}`}>Body</th>
                        <th className="text-right font-normal" title={`Garment relaxed girth (twice the half-width), ${unit}`}>Garment</th>
                        <th className="text-right font-normal">Ext.</th>
                        <th className="text-right font-normal">N/cm</th>
                        <th className="text-right font-normal">mmHg</th>
                        <th />
                      </tr>
                    </thead>
                    <tbody className="figures">
                      {r.girths.map((g) => (
                        <tr key={g.girth} className="border-t border-rule/70" data-testid={`pressure-${r.size}-${g.girth}`}>
                          <td className="py-0.5 font-sans">{girthLabels[g.girth]}</td>
                          <td className="text-right">{len(g.bodyGirthCm, unit)}</td>
                          <td className="text-right">{len(g.garmentGirthCm, unit)}</td>
                          <td className="text-right">{(g.estimate.extension * 100).toFixed(0)} %</td>
                          <td className="text-right" title={g.estimate.extrapolated ? 'Beyond the fabric test: extrapolated' : undefined}>
                            {g.estimate.tensionNPerCm.toFixed(2)}{g.estimate.extrapolated ? '*' : ''}
                          </td>
                          <td className="text-right font-semibold" aria-describedby={cautionId}>
                            {g.estimate.pressureMmHg.toFixed(1)}<sup className="text-ochre-700">†</sup>
                          </td>
                          <td className="pl-1.5 text-right font-sans">
                            <span className={`rounded px-1 py-px text-2xs font-medium ${statusTone[g.status]}`}>{statusText[g.status]}</span>
                          </td>
                        </tr>
                      ))}
                    </tbody>
                  </table>
                  <PressureChart size={r.size} rows={r.girths} band={band} scaleMax={scaleMax} />
                </>
              ) : null}
              {r.missing.length ? (
                <p className="mt-1 text-2xs text-ink-faint">{r.missing.map((m) => m.reason).join('; ')}.</p>
              ) : null}
              {r.girths.some((g) => g.estimate.extrapolated) ? (
                <p className="mt-1 text-2xs text-ochre-700">* Beyond the fabric test’s last point: tension extrapolated. Test the fabric further before relying on it.</p>
              ) : null}
              <div className="mt-1.5"><CompressionCaution id={cautionId} compact /></div>
            </section>
          );
        })}
      </div>
      <div className="mt-4" data-testid="compression-findings">
        <h3 className="mb-1.5 text-xs font-semibold uppercase tracking-[0.06em] text-ink-soft">Findings</h3>
        {findings.length === 0 ? (
          <p className="text-sm text-spruce-700">Every size with a body girth is inside the {target.level} band.</p>
        ) : (
          <ul className="space-y-1.5">
            {findings.map(({ size, g }) => {
              const t = findingText(size, g, target, unit);
              return (
                <li key={`${size}-${g.girth}`} className={`rounded-md border px-2.5 py-1.5 text-sm ${g.status === 'above' ? 'border-madder-500/30 bg-madder-50' : 'border-ochre-500/30 bg-ochre-50'}`} data-testid="compression-finding">
                  <div className={g.status === 'above' ? 'text-madder-700' : 'text-ochre-700'}>{t.message}<sup>†</sup></div>
                  <div className="text-ink">{t.advice}</div>
                </li>
              );
            })}
          </ul>
        )}
        <div className="mt-2"><CompressionCaution /></div>
      </div>
    </Card>
  );
}
