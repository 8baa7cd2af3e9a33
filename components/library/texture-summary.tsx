'use client';

import {
  arealDensity, coursesWithoutElastane, longestFloat, needlePitchMm, repeatSizeMm, stitchesPerCm2, tallestTuckStack, textureTightness,
  yarnPerRepeat, type Texture,
} from '@/lib/knit/texture';
import { describeRuleLimits, ruleLimitSourceLabels, type StudioRuleLimits } from '@/lib/rules/limits';
import type { LibraryYarn } from '@/lib/db/yarns';
import type { TextureFunction } from '@/lib/validations/library';
import { feederSetLetter } from '@/lib/library/chart';
import { feederSetColour } from './feeder-sets-editor';
import { formatPct } from './format';

type Tone = 'ok' | 'warn' | 'error' | 'info';
const toneClass: Record<Tone, string> = {
  ok: 'bg-spruce-500',
  info: 'bg-rule-strong',
  warn: 'bg-ochre-500',
  error: 'bg-madder-500',
};

function Check({ tone, title, children, testId }: { tone: Tone; title: string; children: React.ReactNode; testId?: string }) {
  return (
    <li className="flex gap-2.5" data-testid={testId} data-tone={tone}>
      <span aria-hidden className={`mt-1.5 h-2 w-2 shrink-0 rounded-full ${toneClass[tone]}`} />
      <div>
        <div className="text-sm font-medium text-ink">{title}</div>
        <div className="text-xs text-ink-soft">{children}</div>
      </div>
    </li>
  );
}

/** The courses knitted by one feeder set, as a texture of their own (so lib/knit can weigh them). */
function coursesOf(texture: Texture, courses: readonly number[]): Texture {
  return {
    ...texture,
    repeat: { needles: texture.repeat.needles, courses: courses.length, cells: courses.map((c) => texture.repeat.cells[c] ?? []) },
    feeders: courses.map((c) => texture.feeders[c]!),
  };
}

/**
 * What the texture comes to, computed at once by lib/knit/texture.ts: areal density, yarn per
 * feeder set, floats and tuck stacks against the studio limits, elastane in every course of a
 * compression texture.
 */
export function TextureSummary({ texture, problems, yarns, fn, gauge, courseSet, ruleLimits }: {
  texture: Texture | null;
  problems: readonly string[];
  yarns: readonly LibraryYarn[];
  fn: TextureFunction | null;
  gauge: number;
  courseSet: readonly number[];
  /** The studio's float and tuck limits, with where each comes from. */
  ruleLimits: StudioRuleLimits;
}) {
  if (!texture || problems.length > 0) {
    return (
      <div className="space-y-2 text-sm" data-testid="texture-summary">
        <p className="text-ink-soft">The figures appear once the texture is complete:</p>
        <ul className="list-disc space-y-1 pl-5 text-xs text-madder-700">
          {problems.map((p) => <li key={p}>{p}</li>)}
        </ul>
      </div>
    );
  }
  const byId = new Map(yarns.map((y) => [y.id, y]));
  const gsm = arealDensity(texture, byId, gauge);
  const perRepeat = yarnPerRepeat(texture, byId, gauge);
  const totalGrams = Object.values(perRepeat).reduce((s, u) => s + u.grams, 0);
  const size = repeatSizeMm(texture);
  const float = longestFloat(texture, gauge);
  const tucks = tallestTuckStack(texture);
  const noElastane = coursesWithoutElastane(texture, byId);
  const elastaneShare = Object.entries(perRepeat).reduce((s, [id, u]) => {
    const el = byId.get(id)?.fibres.find((f) => f.fibre === 'elastane')?.share ?? 0;
    return s + (totalGrams > 0 ? (u.grams / totalGrams) * el : 0);
  }, 0);

  const setIndexes = [...new Set(courseSet)].sort((a, b) => a - b);
  const perSet = setIndexes.map((i) => {
    const courses = courseSet.flatMap((s, c) => (s === i ? [c] : []));
    const use = yarnPerRepeat(coursesOf(texture, courses), byId, gauge);
    return { index: i, courses: courses.length, yarns: Object.entries(use).map(([id, u]) => ({ id, grams: u.grams, metres: u.metres })) };
  });
  const { maxFloatMm, maxTuckStack } = ruleLimits.limits;

  return (
    <div className="space-y-5" data-testid="texture-summary">
      <div className="grid grid-cols-2 gap-3">
        <div className="rounded-md bg-paper px-3 py-2">
          <div className="text-xs text-ink-faint">Estimated weight</div>
          <div className="figures text-2xl font-semibold tracking-tight" data-testid="texture-gsm">{gsm.toFixed(0)} <span className="text-sm font-normal text-ink-soft">g/m²</span></div>
        </div>
        <div className="rounded-md bg-paper px-3 py-2">
          <div className="text-xs text-ink-faint">Elastane by mass</div>
          <div className="figures text-2xl font-semibold tracking-tight">{formatPct(elastaneShare)}</div>
        </div>
      </div>
      <dl className="figures grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-xs">
        <dt className="font-sans text-ink-faint">Stitches</dt>
        <dd className="text-right">{stitchesPerCm2(texture).toFixed(0)} per cm²</dd>
        <dt className="font-sans text-ink-faint">Repeat</dt>
        <dd className="text-right">{texture.repeat.needles} × {texture.repeat.courses} = {size.widthMm.toFixed(2)} × {size.heightMm.toFixed(2)} mm</dd>
        <dt className="font-sans text-ink-faint">Tightness factor</dt>
        <dd className="text-right">{textureTightness(texture, byId).toFixed(2)} tex½/mm</dd>
        <dt className="font-sans text-ink-faint">Needle pitch</dt>
        <dd className="text-right">{needlePitchMm(gauge).toFixed(3)} mm at E{gauge}</dd>
      </dl>

      <div>
        <h3 className="mb-2 text-xs font-semibold uppercase tracking-[0.08em] text-ink-faint">Yarn per feeder set</h3>
        <table className="w-full text-xs">
          <thead className="text-left text-ink-faint">
            <tr><th className="pb-1 font-medium">Set</th><th className="pb-1 font-medium">Yarn</th><th className="pb-1 text-right font-medium">g/m²</th><th className="pb-1 text-right font-medium">Share</th></tr>
          </thead>
          <tbody>
            {perSet.map((s) =>
              s.yarns.map((y, k) => (
                <tr key={`${s.index}-${y.id}`} className={k === 0 ? 'border-t border-rule/70' : ''}>
                  <td className="py-1 align-top">
                    {k === 0 ? (
                      <span className="figures inline-flex items-center gap-1 font-semibold">
                        <span aria-hidden className="h-3 w-1 rounded-full" style={{ background: feederSetColour(s.index) }} />
                        {feederSetLetter(s.index)}
                        <span className="font-normal text-ink-faint">{s.courses}c</span>
                      </span>
                    ) : null}
                  </td>
                  <td className="py-1 pr-2 text-ink-soft">{byId.get(y.id)?.name}</td>
                  <td className="figures py-1 text-right">{((y.grams / totalGrams) * gsm).toFixed(1)}</td>
                  <td className="figures py-1 text-right font-medium">{formatPct(y.grams / totalGrams)}</td>
                </tr>
              )),
            )}
          </tbody>
        </table>
      </div>

      <div>
        <h3 className="mb-2 text-xs font-semibold uppercase tracking-[0.08em] text-ink-faint">Checks</h3>
        <ul className="space-y-2.5">
          {!float ? (
            <Check tone="ok" title="No floats" testId="check-float">No course misses a needle.</Check>
          ) : float.unbounded ? (
            <Check tone="error" title="A course misses on every needle" testId="check-float">Course {float.course + 1}: its yarn would float across the whole fabric.</Check>
          ) : (
            <Check tone={(float.mm ?? 0) > maxFloatMm ? 'warn' : 'ok'} title={`Longest float ${(float.mm ?? 0).toFixed(1)} mm`} testId="check-float">
              {float.needles} {float.needles === 1 ? 'needle' : 'needles'} in course {float.course + 1}; limit {maxFloatMm} mm ({ruleLimitSourceLabels[ruleLimits.source.maxFloatMm]}){(float.mm ?? 0) > maxFloatMm ? ': it will snag' : ''}.
            </Check>
          )}
          {!tucks ? (
            <Check tone="ok" title="No tucks" testId="check-tuck">Every loop is knitted or missed.</Check>
          ) : tucks.unbounded ? (
            <Check tone="error" title={`Needle ${tucks.needle + 1} never knits`} testId="check-tuck">It tucks in every course of the repeat; its loops pile up without end.</Check>
          ) : (
            <Check tone={tucks.tucks > maxTuckStack ? 'error' : 'ok'} title={`Tallest tuck stack ${tucks.tucks}`} testId="check-tuck">
              On needle {tucks.needle + 1} from course {tucks.startCourse + 1}; a needle holds at most {maxTuckStack} ({ruleLimitSourceLabels[ruleLimits.source.maxTuckStack]}).
            </Check>
          )}
          {fn === 'compression' && noElastane.length > 0 ? (
            <Check tone="error" title="Compression without elastane in every course" testId="check-elastane">
              {noElastane.length === 1 ? 'Course' : 'Courses'} {noElastane.map((c) => c + 1).join(', ')} of {texture.repeat.courses} lay no elastane: they give no hold. Plate elastane in every course.
            </Check>
          ) : noElastane.length === 0 ? (
            <Check tone="ok" title="Elastane in every course" testId="check-elastane">Ground or plated yarn carries elastane in all {texture.repeat.courses} courses.</Check>
          ) : (
            <Check tone="info" title={`${noElastane.length} of ${texture.repeat.courses} courses without elastane`} testId="check-elastane">
              Fine for a texture not marked for compression.
            </Check>
          )}
        </ul>
        <p className="mt-3 text-2xs text-ink-faint" data-testid="rule-limits">Limits: {describeRuleLimits(ruleLimits)}. Weights are estimates from density, loop lengths and counts.</p>
      </div>
    </div>
  );
}
