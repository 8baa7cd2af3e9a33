'use client';

import { get, useFormContext, useWatch } from 'react-hook-form';
import { convertCount, countUnits, formatCount, type CountUnit } from '@/lib/knit/count';
import { countUnitLabels } from '@/lib/validations/library';
import { Field, Input, Select } from '@/components/ui/field';

/** The count as typed, in dtex; null while it is not a positive number. */
export function typedDtex(value: unknown, unit: CountUnit): number | null {
  const n = typeof value === 'number' ? value : Number(String(value ?? '').replace(',', '.'));
  if (!Number.isFinite(n) || n <= 0) return null;
  return convertCount(n, unit, 'dtex');
}

/** The same count in every system, for the line under a count field. */
export function CountEquivalents({ dtex, except }: { dtex: number | null; except?: CountUnit }) {
  if (dtex === null) return <p className="text-xs text-ink-faint">Enter a count to see it in dtex, den, tex, Nm and Ne.</p>;
  const units: CountUnit[] = ['dtex', 'den', 'tex', 'Nm', 'Ne'];
  return (
    <p className="figures flex flex-wrap gap-x-3 text-xs text-ink-soft" data-testid="count-equivalents">
      {units
        .filter((u) => u !== except)
        .map((u) => (
          <span key={u}>{formatCount(dtex, u, u === 'tex' ? 2 : 1)}</span>
        ))}
    </p>
  );
}

/**
 * A unit-aware count field: the value and its unit (tex, dtex, den, Nm, Ne), with the equivalents
 * shown live. Registers `${name}.value` and `${name}.unit` on the surrounding form.
 */
export function CountInput({ name, label, disabled }: { name: string; label: string; disabled?: boolean }) {
  const { register, control, formState } = useFormContext();
  const value = useWatch({ control, name: `${name}.value` }) as unknown;
  const unit = (useWatch({ control, name: `${name}.unit` }) as CountUnit | undefined) ?? 'dtex';
  const err = (get(formState.errors, `${name}.value`) ?? get(formState.errors, name)) as { message?: string } | undefined;
  const dtex = typedDtex(value, unit);
  return (
    <Field label={label} error={err?.message}>
      {(id) => (
        <div className="space-y-1">
          <div className="flex gap-1.5">
            <Input id={id} inputMode="decimal" className="figures w-28" aria-invalid={!!err} disabled={disabled} {...register(`${name}.value`)} />
            <Select aria-label={`${label} unit`} className="w-24" disabled={disabled} {...register(`${name}.unit`)}>
              {countUnits.map((u) => <option key={u} value={u}>{countUnitLabels[u]}</option>)}
            </Select>
          </div>
          <CountEquivalents dtex={dtex} except={unit} />
        </div>
      )}
    </Field>
  );
}
