'use client';

import { useState } from 'react';
import { api, ApiError } from '@/lib/api/client';
import { defaultLabDipTolerance, toleranceLabel, type LabDipTolerance } from '@/lib/colour/difference';
import { defaultLowContrastDeltaE } from '@/lib/colour/dye-plan';
import type { StudioColourSettings } from '@/lib/db/colourways';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Field, Input, Select } from '@/components/ui/field';

type Formula = 'default' | LabDipTolerance['formula'];
interface FormValues { formula: Formula; l: string; c: string; max: string; lowContrast: string }

function toForm(s: StudioColourSettings): FormValues {
  const t = s.tolerance;
  return {
    formula: s.defaults.includes('tolerance') ? 'default' : t.formula,
    l: t.formula === 'cmc' ? String(t.l) : '2',
    c: t.formula === 'cmc' ? String(t.c) : '1',
    max: String(t.max),
    lowContrast: s.defaults.includes('lowContrastDeltaE') ? '' : String(s.lowContrastDeltaE),
  };
}

/**
 * The studio's colour settings: the lab-dip tolerance for targets without a colour standard, and
 * the ΔE00 below which two tones of a colourway read as one. Blank or "product default" takes the
 * product's value.
 */
export function ColourSettingsForm({ initial, editable }: { initial: StudioColourSettings; editable: boolean }) {
  const [settings, setSettings] = useState(initial);
  const [v, setV] = useState<FormValues>(() => toForm(initial));
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [msg, setMsg] = useState<string | null>(null);
  const err = (k: string) => errors[k]?.[0];

  async function save() {
    const tolerance =
      v.formula === 'default' ? null : v.formula === 'cmc' ? { formula: 'cmc', l: v.l, c: v.c, max: v.max } : { formula: 'de2000', max: v.max };
    try {
      const res = await api<{ colour: StudioColourSettings }>('/api/settings/colour', {
        method: 'PUT',
        json: { tolerance, lowContrastDeltaE: v.lowContrast.trim() === '' ? null : v.lowContrast },
      });
      setErrors({});
      setSettings(res.colour);
      setV(toForm(res.colour));
      setMsg('Saved for the studio');
    } catch (x) {
      if (x instanceof ApiError) { setErrors(x.fieldErrors); setMsg(x.message); } else setMsg('Could not save.');
    }
  }

  return (
    <Card title="Studio colour settings">
      <form className="space-y-3" aria-label="Studio colour settings" onSubmit={(e) => { e.preventDefault(); void save(); }}>
        <fieldset disabled={!editable} className="space-y-3">
          <p className="text-xs text-ink-soft">
            Lab dips for targets entered as CIELAB values (no colour standard) are judged by this tolerance. Dips already sent keep the
            tolerance they were judged by. Now: {toleranceLabel(settings.tolerance)}
            {settings.defaults.includes('tolerance') ? ' (product default)' : ''}.
          </p>
          <div className="grid grid-cols-[1fr_4rem_4rem_5rem] items-end gap-2">
            <Field label="Lab-dip tolerance" error={err('tolerance')}>
              {(id) => (
                <Select id={id} value={v.formula} onChange={(e) => setV({ ...v, formula: e.target.value as Formula })}>
                  <option value="default">Product default, {toleranceLabel(defaultLabDipTolerance)}</option>
                  <option value="cmc">CMC(l:c)</option>
                  <option value="de2000">ΔE00</option>
                </Select>
              )}
            </Field>
            {v.formula === 'cmc' ? (
              <>
                <Field label="l" error={err('tolerance.l')}>{(id) => <Input id={id} inputMode="decimal" className="figures" value={v.l} onChange={(e) => setV({ ...v, l: e.target.value })} />}</Field>
                <Field label="c" error={err('tolerance.c')}>{(id) => <Input id={id} inputMode="decimal" className="figures" value={v.c} onChange={(e) => setV({ ...v, c: e.target.value })} />}</Field>
              </>
            ) : (
              <><span /><span /></>
            )}
            {v.formula !== 'default' ? (
              <Field label="Max ΔE" error={err('tolerance.max')}>{(id) => <Input id={id} inputMode="decimal" className="figures" value={v.max} onChange={(e) => setV({ ...v, max: e.target.value })} />}</Field>
            ) : (
              <span />
            )}
          </div>
          <Field
            label="Low contrast below ΔE00"
            error={err('lowContrastDeltaE')}
            hint={`Two tones of a colourway closer than this read as one colour. Blank: ${defaultLowContrastDeltaE}, the product default.`}
          >
            {(id) => <Input id={id} inputMode="decimal" className="figures max-w-[8rem]" value={v.lowContrast} placeholder={String(defaultLowContrastDeltaE)} onChange={(e) => setV({ ...v, lowContrast: e.target.value })} />}
          </Field>
        </fieldset>
        {editable ? (
          <div className="flex items-center gap-3">
            <Button type="submit">Save colour settings</Button>
            {msg ? <span role="status" className="text-xs text-ink-soft">{msg}</span> : null}
          </div>
        ) : null}
      </form>
    </Card>
  );
}
