'use client';

import { Fragment } from 'react';
import { cylinderNeedles } from '@/lib/fit/needles';
import { nearestDensity, type FlatSizeNeedles, type SeamlessSizeNeedles } from '@/lib/fit/fit-sheet';
import { pointsOfMeasure } from '@/lib/fit/points';
import type { LengthUnit } from '@/lib/fit/units';
import type { FitTexture } from '@/lib/db/fit';
import type { MachineSetup } from '@/lib/validations/style';
import { Card, Notice } from '@/components/ui/card';
import { int, len, signedLen, signedPct } from './format';

const thBase = 'whitespace-nowrap border-b border-rule-strong bg-paper px-1.5 py-1.5 text-xs font-medium text-ink-soft';
const th = `${thBase} text-right`;
const thLeft = `${thBase} text-left`;
const td = 'figures whitespace-nowrap border-b border-rule px-1.5 py-1 text-right tabular-nums';

function Residual({ cm, unit, toleranceCm }: { cm: number; unit: LengthUnit; toleranceCm?: number }) {
  const tone = toleranceCm !== undefined && Math.abs(cm) > toleranceCm ? 'text-madder-700' : 'text-ink-soft';
  return <span className={tone}>{signedLen(cm, unit)}</span>;
}

/** Needles and cylinder per size and point (seamless), or needles per course and courses (flat). */
export function NeedlesCard({
  machine, base, textures, seamless, flat, unit, tolerances,
}: {
  machine: MachineSetup;
  base: FitTexture | null;
  textures: readonly FitTexture[];
  seamless: SeamlessSizeNeedles[] | null;
  flat: FlatSizeNeedles[] | null;
  unit: LengthUnit;
  tolerances: Record<string, number>;
}) {
  const subtitle = base ? (
    <span className="figures text-xs font-normal text-ink-soft">
      {base.name} · {base.walesPerCm} wales × {base.coursesPerCm} courses /cm relaxed · E{machine.gauge}
      {machine.kind === 'circular'
        ? ` · style cylinder ${machine.diameterIn}″ = ${int.format(cylinderNeedles(machine.diameterIn, machine.gauge, machine.needleMultiple))} needles (multiple ${machine.needleMultiple})`
        : ` · bed ${int.format(machine.bedNeedles)} needles`}
    </span>
  ) : null;
  return (
    <Card title={<span className="flex flex-wrap items-baseline gap-x-3">{machine.kind === 'circular' ? 'Needles and cylinder' : 'Needles per point (fashioning)'}{subtitle}</span>}>
      {!base ? (
        <Notice tone="warn">The style has no texture yet: add one in Textures to compute needles.</Notice>
      ) : seamless ? (
        <SeamlessTable rows={seamless} unit={unit} textures={textures} tolerances={tolerances} machineDiameter={machine.kind === 'circular' ? machine.diameterIn : null} />
      ) : flat ? (
        <FlatTable rows={flat} unit={unit} tolerances={tolerances} />
      ) : null}
    </Card>
  );
}

function SeamlessTable({ rows, unit, textures, tolerances, machineDiameter }: {
  rows: SeamlessSizeNeedles[]; unit: LengthUnit; textures: readonly FitTexture[]; tolerances: Record<string, number>; machineDiameter: number | null;
}) {
  const any = rows.some((r) => r.points.length > 0);
  if (!any) return <p className="text-sm text-ink-soft">Enter the tube half-widths ({rows[0] ? 'chest, waist, bottom or the leg points' : ''}) to see needles and cylinders.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-separate border-spacing-0 text-sm" data-testid="needles-table">
        <thead>
          <tr>
            <th className={thLeft}>Size · point</th>
            <th className={th}>Target ½W</th>
            <th className={th} title="Needles across the half-width at the base texture’s density: half the tube">Needles ½W</th>
            <th className={`${th} border-l border-rule`} title="Relaxed half-width on the size’s cylinder at the base density, and relaxed minus target">On the size cylinder</th>
            <th className={`${th} border-l border-rule`} title="Relaxed wales per cm that reach the target on the size’s cylinder">Wales/cm to reach</th>
            <th className={th} title="Courses per cm and loop length at that density, if the structure keeps its loop shape">Courses/cm · loop</th>
            <th className={thLeft} title="A texture of the style within 5 % of that density">Texture near it</th>
            <th className={`${th} border-l border-rule`} title="The available cylinder nearest this point on its own">Nearest alone</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <Fragment key={r.size}>
              <tr className="bg-paper/60">
                <td colSpan={8} className="border-b border-rule px-2 py-1.5 text-xs">
                  <span className="figures mr-2 inline-block min-w-8 rounded bg-ink px-1.5 py-0.5 text-center font-semibold text-white">{r.size}</span>
                  {r.cylinder ? (
                    <span data-testid={`cylinder-${r.size}`}>
                      Cylinder <strong className="figures">{r.cylinder.diameterIn}″</strong> ·{' '}
                      <span className="figures">{int.format(r.cylinder.needles)}</span> needles · relaxed {pointsOfMeasure[r.decidedBy].label.toLowerCase()}{' '}
                      <span className="figures">{len(r.cylinder.halfWidthCm, unit)} {unit}</span> (<Residual cm={r.cylinder.residualCm} unit={unit} toleranceCm={tolerances[r.decidedBy]} />)
                      {machineDiameter !== null && machineDiameter !== r.cylinder.diameterIn ? (
                        <span className="ml-2 rounded bg-ochre-50 px-1.5 py-0.5 text-ochre-700">style machine is {machineDiameter}″</span>
                      ) : null}
                    </span>
                  ) : (
                    <span className="text-ink-faint">No {pointsOfMeasure[r.decidedBy].label.toLowerCase()} for this size: no cylinder chosen.</span>
                  )}
                  {r.lengths.length ? (
                    <div className="mt-0.5 pl-10 text-2xs text-ink-faint">
                      Courses: {r.lengths.map((l) => (
                        <span key={l.point} className="mr-2 whitespace-nowrap">{pointsOfMeasure[l.point].label} <span className="figures text-ink-soft">{int.format(l.courses)}</span></span>
                      ))}
                    </div>
                  ) : null}
                </td>
              </tr>
              {r.points.map((p) => {
                const near = nearestDensity(textures, p.onSizeCylinder.walesPerCm);
                const nearClose = near && Math.abs(near.walesPerCm / p.onSizeCylinder.walesPerCm - 1) <= 0.05;
                const d = p.onSizeCylinder;
                return (
                  <tr key={p.point} data-testid={`needles-${r.size}-${p.point}`}>
                    <th scope="row" className="whitespace-nowrap border-b border-rule py-1 pl-12 pr-2 text-left text-[13px] font-medium">{pointsOfMeasure[p.point].label}</th>
                    <td className={td}>{len(p.targetHalfWidthCm, unit)}</td>
                    <td className={`${td} font-semibold`} data-testid="needles-across">{int.format(p.needlesAcrossHalfWidth)}</td>
                    <td className={`${td} border-l border-rule`}>{len(d.halfWidthCm, unit)} <span className="inline-block w-11"><Residual cm={d.residualCm} unit={unit} toleranceCm={tolerances[p.point]} /></span></td>
                    <td className={`${td} border-l border-rule`}>
                      {d.walesPerCm.toFixed(2)} <span className={Math.abs(d.change) > 0.1 ? 'text-madder-700' : 'text-ink-faint'}>({signedPct(d.change)})</span>
                    </td>
                    <td className={`${td} text-ink-soft`}>{d.coursesPerCm.toFixed(1)} · {signedPct(d.loopLengthChange)}</td>
                    <td className="max-w-[10rem] truncate whitespace-nowrap border-b border-rule px-2 text-xs text-ink-soft" title={nearClose ? `${near.name}: ${near.walesPerCm} wales/cm` : undefined}>
                      {nearClose ? <><span className="figures text-ink-faint">{near.walesPerCm}</span> {near.name}</> : <span className="text-ink-faint">—</span>}
                    </td>
                    <td className={`${td} border-l border-rule`}>
                      {p.nearest.diameterIn}″ <span className="text-ink-faint">{int.format(p.nearest.needles)}</span> <Residual cm={p.nearest.residualCm} unit={unit} />
                    </td>
                  </tr>
                );
              })}
            </Fragment>
          ))}
        </tbody>
      </table>
      <p className="mt-2 text-2xs text-ink-faint">
        Needles = π × diameter × gauge, rounded to the machine’s multiple; relaxed half-width = needles ÷ 2 ÷ wales per cm. Residual is relaxed minus target ({unit}); red beyond the point’s tolerance.
        Density changes above 10 % are red: a structure change rather than a stitch-length setting. Courses and loop length follow the wales if the loop keeps its shape — a first setting for the mill, to be checked on a test knit.
      </p>
    </div>
  );
}

function FlatTable({ rows, unit, tolerances }: { rows: FlatSizeNeedles[]; unit: LengthUnit; tolerances: Record<string, number> }) {
  if (!rows.some((r) => r.widths.length || r.lengths.length)) return <p className="text-sm text-ink-soft">Enter widths and lengths in the spec to see needles and courses.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-separate border-spacing-0 text-sm" data-testid="needles-table">
        <thead>
          <tr>
            <th className={thLeft}>Size</th>
            <th className={thLeft}>Point</th>
            <th className={th}>Target</th>
            <th className={th}>Needles per course</th>
            <th className={th}>Relaxed width</th>
            <th className={th}>Residual</th>
            <th className={th}>Courses</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <Fragment key={r.size}>
              {r.widths.map((w, i) => (
                <tr key={w.point} data-testid={`needles-${r.size}-${w.point}`}>
                  <td className="figures border-b border-rule px-2 font-semibold">{i === 0 ? r.size : ''}</td>
                  <th scope="row" className="border-b border-rule px-2 py-1 text-left text-[13px] font-medium">{pointsOfMeasure[w.point].label}</th>
                  <td className={td}>{len(w.targetCm, unit)}</td>
                  <td className={`${td} font-semibold ${w.fitsBed ? '' : 'text-madder-700'}`} data-testid="needles-across" title={w.fitsBed ? undefined : 'More needles than the bed has'}>{int.format(w.needles)}</td>
                  <td className={td}>{len(w.widthCm, unit)}</td>
                  <td className={td}><Residual cm={w.residualCm} unit={unit} toleranceCm={tolerances[w.point]} /></td>
                  <td className={td} />
                </tr>
              ))}
              {r.lengths.map((l, i) => (
                <tr key={l.point}>
                  <td className="figures border-b border-rule px-2 font-semibold">{r.widths.length === 0 && i === 0 ? r.size : ''}</td>
                  <th scope="row" className="border-b border-rule px-2 py-1 text-left text-[13px] font-medium">{pointsOfMeasure[l.point].label}</th>
                  <td className={td}>{len(l.lengthCm, unit)}</td>
                  <td className={td} />
                  <td className={td} />
                  <td className={td} />
                  <td className={`${td} font-semibold`}>{int.format(l.courses)}</td>
                </tr>
              ))}
            </Fragment>
          ))}
        </tbody>
      </table>
      <p className="mt-2 text-2xs text-ink-faint">A fashioned front panel is as wide as the garment’s half-width at each point; the mill adds its seam allowance. Needles = width × wales per cm; courses = length × courses per cm.</p>
    </div>
  );
}
