'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { api, ApiError } from '@/lib/api/client';
import { ruleLimitSourceLabels, type StudioRuleLimits } from '@/lib/rules/limits';
import { defaultRuleLimits, type RuleLimits } from '@/lib/rules/types';
import { decimalText } from '@/lib/validations/number';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';

const keys = ['maxFloatMm', 'maxTuckStack'] as const satisfies readonly (keyof RuleLimits)[];
const labels: Record<keyof RuleLimits, string> = { maxFloatMm: 'Longest float, mm', maxTuckStack: 'Most tucks stacked on a needle' };

/** Blank when the limit is the default, so saving blank goes back to it. */
const draftOf = (s: StudioRuleLimits) =>
  Object.fromEntries(keys.map((k) => [k, s.source[k] === 'studio' ? String(s.limits[k]) : ''])) as Record<keyof RuleLimits, string>;

/** Text as typed: blank is null (the default), a decimal a number, anything else as it is for the route to refuse. */
function entryOf(text: string): number | string | null {
  const t = text.trim().replace(',', '.');
  if (t === '') return null;
  return decimalText.test(t) ? Number(t) : t;
}

/**
 * The studio's float and tuck-stack limits for its machines, used by the texture checks and the
 * body-map rules. Staff read them; the admin sets them.
 */
export function MachineLimitsForm({ initial, editable }: { initial: StudioRuleLimits; editable: boolean }) {
  const router = useRouter();
  const [current, setCurrent] = useState(initial);
  const [draft, setDraft] = useState(() => draftOf(initial));
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [msg, setMsg] = useState<string | null>(null);

  async function save() {
    const limits = Object.fromEntries(keys.map((k) => [k, entryOf(draft[k])]));
    try {
      const res = await api<{ machineLimits: StudioRuleLimits }>('/api/settings/machine-limits', { method: 'PUT', json: { limits } });
      setCurrent(res.machineLimits);
      setDraft(draftOf(res.machineLimits));
      setErrors({});
      setMsg('Saved for the studio');
      router.refresh();
    } catch (x) {
      if (x instanceof ApiError) { setErrors(x.fieldErrors); setMsg(x.message); } else setMsg('Could not save.');
    }
  }

  // Set once for the studio's machines and rarely changed: folded to one line above the library.
  const summary = `longest float ${current.limits.maxFloatMm} mm (${ruleLimitSourceLabels[current.source.maxFloatMm]}) · at most ${current.limits.maxTuckStack} tucks stacked (${ruleLimitSourceLabels[current.source.maxTuckStack]})`;
  return (
    <details className="mb-4 rounded-[var(--radius-card)] border border-rule bg-panel shadow-[0_1px_2px_rgba(31,36,40,0.04)]">
      <summary className="cursor-pointer px-4 py-2.5 text-[13px]">
        <span className="font-semibold tracking-tight text-ink">Machine limits</span>
        <span className="text-ink-soft"> · {summary}</span>
      </summary>
      <div className="border-t border-rule p-4">
      <form className="space-y-3" aria-label="Machine limits" onSubmit={(e) => { e.preventDefault(); void save(); }}>
        <p className="text-xs text-ink-soft">What the studio’s machines knit safely. The texture checks and the body-map rules test floats and tuck stacks against these.</p>
        <fieldset disabled={!editable} className="grid max-w-xl grid-cols-2 gap-3">
          {keys.map((k) => (
            <Field
              key={k}
              label={labels[k]}
              error={errors[`limits.${k}`]?.[0]}
              hint={`${current.limits[k]}: ${ruleLimitSourceLabels[current.source[k]]}${current.source[k] === 'studio' ? `; blank goes back to the default ${defaultRuleLimits[k]}` : ''}`}
            >
              {(id) => (
                <Input id={id} data-testid={`limit-${k}`} inputMode="decimal" value={draft[k]} placeholder={String(defaultRuleLimits[k])} onChange={(e) => setDraft({ ...draft, [k]: e.target.value })} />
              )}
            </Field>
          ))}
        </fieldset>
        {editable ? (
          <div className="flex items-center gap-3">
            <Button type="submit">Save machine limits</Button>
            {msg ? <span role="status" className="text-xs text-ink-soft">{msg}</span> : null}
          </div>
        ) : (
          <p className="text-xs text-ink-faint">The studio admin sets these.</p>
        )}
      </form>
      </div>
    </details>
  );
}
