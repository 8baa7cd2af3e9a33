'use client';

import type { LibraryYarn } from '@/lib/db/yarns';
import { feederSetLetter } from '@/lib/library/chart';
import { Button } from '@/components/ui/button';
import { Input, Select } from '@/components/ui/field';
import { yarnOption } from './format';

/** A feeder set as the editor holds it: yarn ids, the draft as typed. */
export interface FeederSetDraft {
  ground: string;
  plated: { yarn: string; draft: string } | null;
}

/** Colours that tell feeder sets apart beside the chart (not yarn colours). */
export const feederSetColours = ['#22665a', '#3f4f8f', '#b7831f', '#b8453c', '#4a5157', '#7d5811', '#1a5148', '#8a2c25'];

export const feederSetColour = (i: number) => feederSetColours[i % feederSetColours.length] ?? '#4a5157';

export function feederSetLabel(set: FeederSetDraft, yarns: ReadonlyMap<string, LibraryYarn>): string {
  const ground = yarns.get(set.ground)?.name ?? 'no ground yarn';
  if (!set.plated) return ground;
  const plated = yarns.get(set.plated.yarn)?.name ?? 'no plated yarn';
  return `${ground} + ${plated} at ${set.plated.draft || '?'}×`;
}

const hasElastane = (y: LibraryYarn) => y.fibres.some((f) => f.fibre === 'elastane' && f.share > 0);

function YarnSelect({ value, onChange, label, yarns, allowNone, disabled, invalid }: {
  value: string; onChange: (v: string) => void; label: string; yarns: readonly LibraryYarn[]; allowNone?: boolean; disabled?: boolean; invalid?: boolean;
}) {
  const elastic = yarns.filter(hasElastane);
  const other = yarns.filter((y) => !hasElastane(y));
  return (
    <Select aria-label={label} value={value} onChange={(e) => onChange(e.target.value)} disabled={disabled} aria-invalid={invalid} className="min-w-0">
      {allowNone ? <option value="">None</option> : value === '' ? <option value="">Choose a yarn…</option> : null}
      <optgroup label={allowNone ? 'With elastane' : 'Without elastane'}>
        {(allowNone ? elastic : other).map((y) => <option key={y.id} value={y.id}>{yarnOption(y)}</option>)}
      </optgroup>
      <optgroup label={allowNone ? 'Other yarns' : 'With elastane'}>
        {(allowNone ? other : elastic).map((y) => <option key={y.id} value={y.id}>{yarnOption(y)}</option>)}
      </optgroup>
    </Select>
  );
}

/**
 * The yarn sets the chart's courses pick from: each a ground yarn and an optional plated yarn
 * (usually bare elastane) with its draft.
 */
export function FeederSetsEditor({ sets, usage, yarns, readOnly, errors, onChange }: {
  sets: readonly FeederSetDraft[];
  /** Courses using each set. */
  usage: readonly number[];
  yarns: readonly LibraryYarn[];
  readOnly?: boolean;
  /** Errors per set index, in words. */
  errors: Readonly<Record<number, string[]>>;
  onChange: (next: FeederSetDraft[], removed?: number) => void;
}) {
  const update = (i: number, set: FeederSetDraft) => onChange(sets.map((s, k) => (k === i ? set : s)));
  const firstElastic = yarns.find((y) => y.fibres.length === 1 && y.fibres[0]?.fibre === 'elastane');
  return (
    <div className="space-y-2">
      <table className="w-full text-sm">
        <thead className="text-left text-xs text-ink-faint">
          <tr>
            <th className="w-10 pb-1.5 font-medium">Set</th>
            <th className="pb-1.5 font-medium">Ground yarn</th>
            <th className="pb-1.5 font-medium">Plated yarn</th>
            <th className="w-24 pb-1.5 font-medium">Draft</th>
            <th className="w-20 pb-1.5 text-right font-medium">Courses</th>
            {readOnly ? null : <th className="w-20" />}
          </tr>
        </thead>
        <tbody>
          {sets.map((s, i) => {
            const letter = feederSetLetter(i);
            const errs = errors[i] ?? [];
            return (
              <tr key={i} className="border-t border-rule/70 align-top">
                <td className="py-2">
                  <span className="figures inline-flex h-7 w-7 items-center justify-center rounded-md text-xs font-semibold text-white" style={{ background: feederSetColour(i) }}>{letter}</span>
                </td>
                <td className="py-2 pr-2">
                  <YarnSelect label={`Ground yarn of feeder set ${letter}`} value={s.ground} yarns={yarns} disabled={readOnly} invalid={errs.length > 0 && !s.ground} onChange={(v) => update(i, { ...s, ground: v })} />
                  {errs.length ? <p role="alert" className="mt-1 text-xs text-madder-700">{errs.join(' ')}</p> : null}
                </td>
                <td className="py-2 pr-2">
                  <YarnSelect
                    label={`Plated yarn of feeder set ${letter}`}
                    value={s.plated?.yarn ?? ''}
                    yarns={yarns}
                    allowNone
                    disabled={readOnly}
                    onChange={(v) => update(i, { ...s, plated: v ? { yarn: v, draft: s.plated?.draft ?? '2.8' } : null })}
                  />
                </td>
                <td className="py-2 pr-2">
                  {s.plated ? (
                    <Input aria-label={`Draft of the plated yarn in feeder set ${letter}`} inputMode="decimal" className="figures" disabled={readOnly} value={s.plated.draft} onChange={(e) => update(i, { ...s, plated: { yarn: s.plated!.yarn, draft: e.target.value } })} />
                  ) : (
                    <span className="flex h-9 items-center text-ink-faint">—</span>
                  )}
                </td>
                <td className="figures py-2 text-right leading-9 text-ink-soft">{usage[i] ?? 0}</td>
                {readOnly ? null : (
                  <td className="py-2 text-right">
                    <Button type="button" size="sm" variant="ghost" className="mt-1" disabled={sets.length <= 1 || (usage[i] ?? 0) > 0} title={(usage[i] ?? 0) > 0 ? 'Courses still use this set' : undefined} onClick={() => onChange(sets.filter((_, k) => k !== i), i)}>
                      Remove
                    </Button>
                  </td>
                )}
              </tr>
            );
          })}
        </tbody>
      </table>
      {readOnly ? null : (
        <div className="flex items-center gap-3">
          <Button
            type="button"
            size="sm"
            disabled={sets.length >= 8}
            onClick={() => onChange([...sets, { ground: sets[0]?.ground ?? '', plated: firstElastic ? { yarn: firstElastic.id, draft: '2.8' } : null }])}
          >
            Add feeder set
          </Button>
          <span className="text-xs text-ink-faint">Pick each course’s set beside the chart. Draft: elastane length in the fabric ÷ length off its package.</span>
        </div>
      )}
    </div>
  );
}
