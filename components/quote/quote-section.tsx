'use client';

import { Fragment, useState } from 'react';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { api, ApiError } from '@/lib/api/client';
import type { StyleQuote } from '@/lib/db/quotes';
import { makingUpKeys, makingUpLabels, rateLabels } from '@/lib/cost/rates';
import { StudioRates } from './studio-rates';
import type { QuoteInputs } from '@/lib/validations/quote';
import { Card, Notice } from '@/components/ui/card';
import { Button, ButtonLink } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';

const key = (styleId: string) => ['quote', styleId] as const;
const money = (n: number | null, c: string) => (n === null ? '—' : `${n.toFixed(2)} ${c}`);
const numOrNull = (v: string) => (v.trim() === '' ? null : Number(v.replace(',', '.')));

function SizeTable({ q }: { q: StyleQuote }) {
  const [open, setOpen] = useState<string | null>(null);
  const [orderOpen, setOrderOpen] = useState(false);
  const c = q.quote.currency;
  return (
    <table className="w-full text-sm" data-testid="quote-table">
      <thead className="text-left text-xs text-ink-faint">
        <tr><th className="py-1.5">Size</th><th>Garments</th><th className="text-right">Yarn g</th><th className="text-right">Knit min</th><th className="text-right">Cost / garment</th><th className="text-right">Margin / garment</th><th className="text-right">Order cost</th><th className="text-right">Order margin</th><th /></tr>
      </thead>
      <tbody className="figures">
        {q.quote.sizes.map((s) => (
          <Fragment key={s.size}>
            <tr className="border-t border-rule">
              <td className="py-1.5 font-medium">{s.size}</td>
              <td>{s.garments}</td>
              <td className="text-right">{s.yarnGrams.toFixed(1)}</td>
              <td className="text-right">{s.knitting.minutes.toFixed(2)}</td>
              <td className="text-right">{money(s.perGarment, c)}</td>
              <td className={`text-right ${s.marginPerGarment !== null && s.marginPerGarment < 0 ? 'text-madder-700' : ''}`}>{money(s.marginPerGarment, c)}{s.marginShare === null ? '' : ` (${(s.marginShare * 100).toFixed(1)} %)`}</td>
              <td className="text-right">{money(s.orderCost, c)}</td>
              <td className="text-right">{money(s.orderMargin, c)}</td>
              <td className="text-right"><Button type="button" size="sm" variant="ghost" aria-expanded={open === s.size} onClick={() => setOpen(open === s.size ? null : s.size)}>{open === s.size ? 'Hide' : 'How'}</Button></td>
            </tr>
            {open === s.size ? (
              <tr><td colSpan={9} className="bg-paper px-2 pb-2">
                <table className="w-full text-xs" aria-label={`How size ${s.size} was computed`}>
                  <tbody>
                    {s.lines.map((l) => (
                      <tr key={l.key} className="border-t border-rule/60"><td className="py-1 pr-2 text-ink">{l.label}</td><td className="pr-2 text-ink-soft">{l.how}</td><td className="text-right">{money(l.amount, c)}</td></tr>
                    ))}
                    {[
                      { key: 'total', label: 'Cost per garment', how: s.how.perGarment, amount: s.perGarment },
                      { key: 'margin', label: 'Margin per garment', how: s.how.margin, amount: s.marginPerGarment },
                      { key: 'order-cost', label: `Order cost, size ${s.size}`, how: s.how.orderCost, amount: s.orderCost },
                      { key: 'order-margin', label: `Order margin, size ${s.size}`, how: s.how.orderMargin, amount: s.orderMargin },
                    ].map((t) => (t.how === null ? null : (
                      <tr key={t.key} className="border-t border-rule font-medium"><td className="py-1 pr-2 text-ink">{t.label}</td><td className="pr-2 font-normal text-ink-soft">{t.how}</td><td className="text-right">{money(t.amount, c)}</td></tr>
                    )))}
                  </tbody>
                </table>
              </td></tr>
            ) : null}
          </Fragment>
        ))}
        <tr className="border-t-2 border-rule-strong font-medium">
          <td className="py-1.5">All</td><td>{q.quote.order.garments}</td><td /><td /><td /><td className="text-right text-xs text-ink-soft">{q.quote.targetPricePerGarment === null ? 'no target price' : `target ${money(q.quote.targetPricePerGarment, c)}`}</td>
          <td className="text-right">{money(q.quote.order.cost, c)}</td><td className="text-right">{money(q.quote.order.margin, c)}</td>
          <td className="text-right"><Button type="button" size="sm" variant="ghost" aria-expanded={orderOpen} onClick={() => setOrderOpen(!orderOpen)}>{orderOpen ? 'Hide' : 'How'}</Button></td>
        </tr>
        {orderOpen ? (
          <tr><td colSpan={9} className="bg-paper px-2 pb-2">
            <table className="w-full text-xs" aria-label="How the order totals were computed">
              <tbody>
                {[
                  { key: 'cost', label: 'Order cost', how: q.quote.order.how.cost, amount: q.quote.order.cost },
                  { key: 'revenue', label: 'Order at the target price', how: q.quote.order.how.revenue, amount: q.quote.order.revenue },
                  { key: 'margin', label: 'Order margin', how: q.quote.order.how.margin, amount: q.quote.order.margin },
                ].map((t) => (t.how === null ? null : (
                  <tr key={t.key} className="border-t border-rule/60"><td className="py-1 pr-2 text-ink">{t.label}</td><td className="pr-2 text-ink-soft">{t.how}</td><td className="text-right">{money(t.amount, c)}</td></tr>
                )))}
              </tbody>
            </table>
          </td></tr>
        ) : null}
      </tbody>
    </table>
  );
}

function Entries({ q, onSaved, editable }: { q: StyleQuote; onSaved: (q: StyleQuote) => void; editable: boolean }) {
  const [v, setV] = useState(() => ({
    speedPerMinute: q.inputs.speedPerMinute?.toString() ?? '', feedersPerCourse: String(q.inputs.feedersPerCourse), efficiency: q.inputs.efficiency?.toString() ?? '',
    minuteRate: q.inputs.minuteRate?.toString() ?? '', millId: q.inputs.millId ?? '', includeTrims: q.inputs.includeTrims,
    makingUp: Object.fromEntries(makingUpKeys.map((k) => [k, q.inputs.makingUp[k]?.toString() ?? ''])) as Record<(typeof makingUpKeys)[number], string>,
  }));
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [msg, setMsg] = useState<string | null>(null);
  const r = q.studio.rates;
  const example = (k: string) => (q.studio.defaults.includes(k) ? ` (${q.studio.note})` : ' (studio rate)');
  async function save() {
    setMsg(null);
    const inputs: QuoteInputs = {
      speedPerMinute: numOrNull(v.speedPerMinute), feedersPerCourse: Number(v.feedersPerCourse), efficiency: numOrNull(v.efficiency), minuteRate: numOrNull(v.minuteRate),
      millId: v.millId === '' ? null : v.millId,
      includeTrims: v.includeTrims, makingUp: Object.fromEntries(makingUpKeys.map((k) => [k, numOrNull(v.makingUp[k])])) as QuoteInputs['makingUp'],
    };
    try {
      const res = await api<{ quote: StyleQuote }>(`/api/styles/${q.styleId}/quote`, { method: 'PUT', json: { version: q.version, inputs } });
      setErrors({});
      onSaved(res.quote);
      setMsg('Saved');
    } catch (x) {
      if (x instanceof ApiError) { setErrors(x.fieldErrors); setMsg(x.message); } else setMsg('Could not save.');
    }
  }
  const err = (k: string) => errors[`inputs.${k}`]?.[0];
  const circular = q.machine.kind === 'circular';
  return (
    <form className="space-y-3" onSubmit={(e) => { e.preventDefault(); void save(); }} aria-label="Quote entries">
      <fieldset disabled={!editable} className="grid grid-cols-2 gap-3">
        <Field label={circular ? 'Machine speed, rpm' : 'Carriage passes per minute'} error={err('speedPerMinute')} hint={`Empty: ${circular ? r.circularRpm : r.flatPassesPerMinute}${example(circular ? 'circularRpm' : 'flatPassesPerMinute')}`}>
          {(id) => <Input id={id} inputMode="decimal" value={v.speedPerMinute} onChange={(e) => setV({ ...v, speedPerMinute: e.target.value })} />}
        </Field>
        <Field label="Feeders used per course" error={err('feedersPerCourse')} hint={`The machine has ${q.machine.feeders}`}>
          {(id) => <Input id={id} inputMode="numeric" value={v.feedersPerCourse} onChange={(e) => setV({ ...v, feedersPerCourse: e.target.value })} />}
        </Field>
        <Field label="Efficiency (0–1)" error={err('efficiency')} hint={`Empty: ${r.efficiency}${example('efficiency')}`}>
          {(id) => <Input id={id} inputMode="decimal" value={v.efficiency} onChange={(e) => setV({ ...v, efficiency: e.target.value })} />}
        </Field>
        <Field label={`Machine-minute rate, ${r.currency}`} error={err('minuteRate')} hint={`Empty: ${r.machineMinuteRate}${example('machineMinuteRate')}`}>
          {(id) => <Input id={id} inputMode="decimal" value={v.minuteRate} onChange={(e) => setV({ ...v, minuteRate: e.target.value })} />}
        </Field>
        <Field label="Mill whose minute rate is used" error={err('millId')} hint="Used when no rate is entered for this style">
          {(id) => (
            <Select id={id} value={v.millId} onChange={(e) => setV({ ...v, millId: e.target.value })}>
              <option value="">The studio rate</option>
              {q.studio.mills.map((m) => <option key={m.id} value={m.id}>{m.name}{m.minuteRate === null ? ' (no rate set)' : `: ${m.minuteRate} ${r.currency}/min`}</option>)}
            </Select>
          )}
        </Field>
        {makingUpKeys.map((k) => (
          <Field key={k} label={`${makingUpLabels[k]} per garment, ${r.currency}`} error={err(`makingUp.${k}`)} hint={`Empty: ${r.makingUp[k]}${example(`makingUp.${k}`)}`}>
            {(id) => <Input id={id} inputMode="decimal" value={v.makingUp[k]} onChange={(e) => setV({ ...v, makingUp: { ...v.makingUp, [k]: e.target.value } })} />}
          </Field>
        ))}
        <label className="col-span-2 flex items-center gap-2 text-sm"><input type="checkbox" checked={v.includeTrims} onChange={(e) => setV({ ...v, includeTrims: e.target.checked })} />Trims and labels from the Trims list</label>
      </fieldset>
      {editable ? <div className="flex items-center gap-3"><Button type="submit" variant="primary">Save and recompute</Button>{msg ? <span role="status" className="text-xs text-ink-soft">{msg}</span> : null}</div> : null}
    </form>
  );
}

export function QuoteSection({ styleId, initial, editable }: { styleId: string; initial: StyleQuote; editable: boolean }) {
  const qc = useQueryClient();
  const { data: q } = useQuery({
    queryKey: key(styleId), queryFn: () => api<{ quote: StyleQuote }>(`/api/styles/${styleId}/quote`).then((r) => r.quote), initialData: initial,
  });
  return (
    <div className="grid grid-cols-1 gap-5 xl:grid-cols-[1fr_360px]" data-testid="quote-section">
      <Card
        title="Quote per size"
        actions={<>
          <ButtonLink href={`/api/styles/${styleId}/quote/export?format=pdf`}>Download PDF</ButtonLink>
          <ButtonLink href={`/api/styles/${styleId}/quote/export?format=csv`}>Download CSV</ButtonLink>
        </>}
      >
        <div className="space-y-3">
          {q.basis.map((b) => <p key={b} className="text-xs text-ink-soft">{b}</p>)}
          {q.quote.problems.map((p) => <Notice key={p} tone="warn">{p}</Notice>)}
          <SizeTable q={q} />
          {q.studio.defaults.length ? <p className="text-xs text-ochre-700">Still an {q.studio.note}: {q.studio.defaults.map((k) => rateLabels[k] ?? k).join(', ')}. Set them under Studio rates.</p> : null}
          <p className="text-xs text-ink-faint">Studio only: costs, prices and margins are never shown to the mill or the client.</p>
        </div>
      </Card>
      <div className="space-y-5">
        <Card title="Entries for this style">
          <Entries q={q} editable={editable} onSaved={(n) => qc.setQueryData(key(styleId), n)} />
        </Card>
        <Card title="Studio rates">
          <StudioRates studio={q.studio} editable={editable} onSaved={() => void qc.invalidateQueries({ queryKey: key(styleId) })} />
        </Card>
      </div>
    </div>
  );
}
