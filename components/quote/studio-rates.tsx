'use client';

import { useState } from 'react';
import { api, ApiError } from '@/lib/api/client';
import { makingUpKeys, makingUpLabels, trimCostKinds, type CostRates } from '@/lib/cost/rates';
import type { StudioCostRates } from '@/lib/db/quotes';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';

type Flat = Record<string, string>;
const scalar = ['currency', 'machineMinuteRate', 'efficiency', 'circularRpm', 'flatPassesPerMinute', 'flatSystems', 'wasteAllowance'] as const;
const labels: Record<(typeof scalar)[number], string> = {
  currency: 'Currency (ISO code)', machineMinuteRate: 'Machine-minute rate', efficiency: 'Efficiency (0–1)', circularRpm: 'Circular machine rpm',
  flatPassesPerMinute: 'V-bed passes per minute', flatSystems: 'V-bed systems', wasteAllowance: 'Yarn waste allowance (0–1)',
};

function flatten(s: StudioCostRates): Flat {
  const set = (k: string, v: string | number) => (s.defaults.includes(k) ? '' : String(v));
  const out: Flat = {};
  for (const k of scalar) out[k] = set(k, s.rates[k]);
  for (const k of makingUpKeys) out[`makingUp.${k}`] = set(`makingUp.${k}`, s.rates.makingUp[k]);
  for (const k of trimCostKinds) out[`trimUnitCost.${k}`] = set(`trimUnitCost.${k}`, s.rates.trimUnitCost[k]);
  return out;
}

const exampleOf = (s: StudioCostRates, k: string): string => {
  const [a, b] = k.split('.') as [keyof CostRates, string | undefined];
  const v = b ? (s.rates[a] as Record<string, number>)[b] : s.rates[a];
  return String(v);
};

/** The studio's costing rates: blank takes the example value. */
export function StudioRates({ studio, editable, onSaved }: { studio: StudioCostRates; editable: boolean; onSaved: () => void }) {
  const [v, setV] = useState<Flat>(() => flatten(studio));
  const [mills, setMills] = useState<Flat>(() => Object.fromEntries(studio.mills.map((m) => [m.id, m.minuteRate === null ? '' : String(m.minuteRate)])));
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [msg, setMsg] = useState<string | null>(null);
  /** A rate as typed: blank is null (back to the example value), a decimal comma is read as a point. */
  const parse = (t: string) => (t.trim() === '' ? null : Number(t.replace(',', '.')));
  const num = (k: string) => parse(v[k]!);
  async function save() {
    const rates = {
      currency: v.currency!.trim() === '' ? null : v.currency!.trim().toUpperCase(),
      machineMinuteRate: num('machineMinuteRate'), efficiency: num('efficiency'), circularRpm: num('circularRpm'),
      flatPassesPerMinute: num('flatPassesPerMinute'), flatSystems: num('flatSystems'), wasteAllowance: num('wasteAllowance'),
      makingUp: Object.fromEntries(makingUpKeys.map((k) => [k, num(`makingUp.${k}`)])),
      trimUnitCost: Object.fromEntries(trimCostKinds.map((k) => [k, num(`trimUnitCost.${k}`)])),
    };
    try {
      const millRates = Object.fromEntries(Object.entries(mills).map(([id, t]) => [id, parse(t)]));
      await api('/api/settings/costing', { method: 'PUT', json: { rates, mills: millRates } });
      setErrors({});
      setMsg('Saved for the studio');
      onSaved();
    } catch (x) {
      if (x instanceof ApiError) { setErrors(x.fieldErrors); setMsg(x.message); } else setMsg('Could not save.');
    }
  }
  const field = (k: string, label: string) => (
    <Field key={k} label={label} error={errors[`rates.${k}`]?.[0]} hint={v[k] ? undefined : `${exampleOf(studio, k)}: ${studio.note}`}>
      {(id) => <Input id={id} value={v[k] ?? ''} placeholder={exampleOf(studio, k)} onChange={(e) => setV({ ...v, [k]: e.target.value })} />}
    </Field>
  );
  return (
    <form className="space-y-3" aria-label="Studio rates" onSubmit={(e) => { e.preventDefault(); void save(); }}>
      <fieldset disabled={!editable} className="grid grid-cols-2 gap-3">
        {scalar.map((k) => field(k, labels[k]))}
        {makingUpKeys.map((k) => field(`makingUp.${k}`, `${makingUpLabels[k]} per garment`))}
        {trimCostKinds.map((k) => field(`trimUnitCost.${k}`, `Trim: ${k}, per piece`))}
        {studio.mills.map((m) => (
          <Field key={m.id} label={`Machine-minute rate of ${m.name}`} error={errors[`mills.${m.id}`]?.[0]} hint="Blank: none set; quotes choosing this mill use the studio rate">
            {(id) => <Input id={id} inputMode="decimal" value={mills[m.id] ?? ''} onChange={(e) => setMills({ ...mills, [m.id]: e.target.value })} />}
          </Field>
        ))}
      </fieldset>
      {editable ? <div className="flex items-center gap-3"><Button type="submit">Save studio rates</Button>{msg ? <span role="status" className="text-xs text-ink-soft">{msg}</span> : null}</div> : null}
    </form>
  );
}
