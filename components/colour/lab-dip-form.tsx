'use client';

import { useState } from 'react';
import { useForm, useWatch, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api, ApiError } from '@/lib/api/client';
import { labDipInputSchema, type LabDipInput } from '@/lib/validations/colour';
import { meanLab, parseLabReadings, readLabDip } from '@/lib/colour/lab-dip';
import type { Lab } from '@/lib/colour/lab';
import type { Colourway } from '@/lib/db/colourways';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/card';
import { Field, Input, Select } from '@/components/ui/field';
import { PairSwatch, fmtLab } from './swatch';
import { colourKeys } from './use-colour';

type FormIn = z.input<typeof labDipInputSchema>;
type Mode = 'one' | 'csv';

const asNumber = (v: unknown) => (typeof v === 'string' && v.trim() !== '' ? Number(v.replace(',', '.').replace('−', '-')) : typeof v === 'number' ? v : NaN);

/**
 * The dye house's lab-dip form: the target, the measured colour (one reading, or several pasted
 * or loaded from the instrument's CSV), a comment and optionally a photo.
 */
export function LabDipForm({ styleId, colourways, initialColourwayId }: { styleId: string; colourways: readonly Colourway[]; initialColourwayId?: string }) {
  const qc = useQueryClient();
  const [mode, setMode] = useState<Mode>('one');
  const [serverError, setServerError] = useState<string | null>(null);
  const [sent, setSent] = useState<string | null>(null);
  const [photo, setPhoto] = useState<File | null>(null);
  const [photoKey, setPhotoKey] = useState(0);
  const firstTarget = (colourways.find((c) => c.id === initialColourwayId) ?? colourways[0])?.targets[0]?.id ?? '';
  const form = useForm<FormIn, unknown, LabDipInput>({
    resolver: zodResolver(labDipInputSchema) as Resolver<FormIn, unknown, LabDipInput>,
    defaultValues: { targetId: firstTarget, measured: { L: '', a: '', b: '' } as unknown as Lab, comment: '' },
  });
  const { register, handleSubmit, formState, setError, reset, setValue, control } = form;
  const targetId = useWatch({ control, name: 'targetId' });
  const measured = useWatch({ control, name: 'measured' }) as Record<string, unknown> | undefined;
  const csv = useWatch({ control, name: 'readingsCsv' }) ?? '';
  const target = colourways.flatMap((c) => c.targets).find((t) => t.id === targetId);

  let sample: Lab | null = null;
  let readingsNote = '';
  if (mode === 'one') {
    const L = asNumber(measured?.L);
    const a = asNumber(measured?.a);
    const b = asNumber(measured?.b);
    if ([L, a, b].every(Number.isFinite) && L >= 0 && L <= 100) sample = { L, a, b };
  } else if (csv.trim()) {
    const parsed = parseLabReadings(csv);
    if (parsed.readings.length) {
      sample = meanLab(parsed.readings);
      readingsNote = `${parsed.readings.length} reading${parsed.readings.length === 1 ? '' : 's'}, mean ${fmtLab(sample)}`;
    }
    if (parsed.errors.length) readingsNote += `${readingsNote ? ' · ' : ''}${parsed.errors.length} line${parsed.errors.length === 1 ? '' : 's'} not read`;
  }
  const preview = target && sample ? readLabDip(target.colour, sample, target.tolerance) : null;

  const switchMode = (m: Mode) => {
    setMode(m);
    if (m === 'one') {
      setValue('readingsCsv', undefined);
      setValue('measured', { L: '', a: '', b: '' } as unknown as Lab);
    } else {
      setValue('measured', undefined);
      setValue('readingsCsv', '');
    }
  };

  const onFile = async (file: File | undefined) => {
    if (!file) return;
    if (file.size > 20_000) {
      setError('readingsCsv', { message: 'The file is too large for one lab dip (20 kB at most).' });
      return;
    }
    setValue('readingsCsv', await file.text(), { shouldDirty: true, shouldValidate: true });
  };

  const onSubmit = handleSubmit(async (values) => {
    setServerError(null);
    setSent(null);
    try {
      // The photo goes to the style's files first; the dip refers to it by id.
      let photoFileId: string | undefined;
      if (photo) {
        const data = new FormData();
        data.set('file', photo);
        try {
          photoFileId = (await api<{ file: { id: string } }>(`/api/styles/${styleId}/files`, { method: 'POST', body: data })).file.id;
        } catch (err) {
          const msg = err instanceof ApiError ? (Object.values(err.fieldErrors)[0]?.[0] ?? err.message) : 'The photo could not be uploaded.';
          setError('photoFileId', { message: msg });
          setServerError(`${msg} The dip was not sent; remove the photo to send the readings alone.`);
          return;
        }
      }
      // Sent as typed: the server reads the readings with the same schema.
      const entry = mode === 'one' ? { measured: values.readings[0] } : { readingsCsv: csv };
      const body = { targetId: values.targetId, ...entry, comment: values.comment, ...(photoFileId ? { photoFileId } : {}) };
      const res = await api<{ labDip: { targetName: string; sequence: number } }>(`/api/styles/${styleId}/lab-dips`, { method: 'POST', json: body });
      setSent(`Sent ${res.labDip.targetName} #${res.labDip.sequence}. The colour lead decides; the decision shows below.`);
      setPhoto(null);
      setPhotoKey((k) => k + 1);
      reset({ targetId: values.targetId, measured: mode === 'one' ? ({ L: '', a: '', b: '' } as unknown as Lab) : undefined, readingsCsv: mode === 'csv' ? '' : undefined, comment: '' });
      await qc.invalidateQueries({ queryKey: colourKeys.labDips(styleId) });
    } catch (err) {
      if (err instanceof ApiError) {
        for (const [path, msgs] of Object.entries(err.fieldErrors)) setError(path as never, { message: msgs.join(' ') });
        setServerError(err.message);
      } else setServerError('Sending failed. The values are still in the form; try again.');
    }
  });

  const err = (path: string): string | undefined => {
    let node: unknown = formState.errors;
    for (const part of path.split('.')) node = (node as Record<string, unknown> | undefined)?.[part];
    return (node as { message?: string } | undefined)?.message;
  };

  if (colourways.every((c) => c.targets.length === 0)) {
    return <p className="text-sm text-ink-soft">No targets to match yet: the studio has not set the colourway’s colours.</p>;
  }

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3" aria-label="Submit a lab dip">
      {serverError ? <Notice tone="error">{serverError}</Notice> : null}
      {sent ? <Notice>{sent}</Notice> : null}
      <Field label="Target" error={err('targetId')}>
        {(id) => (
          <Select id={id} {...register('targetId')}>
            {colourways.map((c) => (
              <optgroup key={c.id} label={c.name}>
                {c.targets.map((t) => <option key={t.id} value={t.id}>{t.name}{t.standardName ? ` — ${t.standardName}` : ''}</option>)}
              </optgroup>
            ))}
          </Select>
        )}
      </Field>
      <div role="radiogroup" aria-label="How to enter the colour" className="inline-flex rounded-md border border-rule-strong p-0.5 text-xs">
        {(['one', 'csv'] as const).map((m) => (
          <button
            key={m}
            type="button"
            role="radio"
            aria-checked={mode === m}
            onClick={() => switchMode(m)}
            className={`rounded px-2.5 py-1 font-medium ${mode === m ? 'bg-spruce-600 text-white' : 'text-ink-soft hover:text-ink'}`}
          >
            {m === 'one' ? 'One reading' : 'Readings (CSV)'}
          </button>
        ))}
      </div>
      {mode === 'one' ? (
        <div className="grid grid-cols-3 gap-2">
          {(['L', 'a', 'b'] as const).map((k) => (
            <Field key={k} label={`Measured ${k}*`} error={err(`measured.${k}`) ?? (k === 'L' ? err('measured') : undefined)}>
              {(id) => <Input id={id} inputMode="decimal" className="figures" {...register(`measured.${k}` as never)} aria-invalid={!!err(`measured.${k}`)} />}
            </Field>
          ))}
        </div>
      ) : (
        <div className="space-y-1.5">
          <Field label="Readings" error={err('readingsCsv')} hint="One reading per line, L*, a*, b* (a header line naming the columns is read too). Comma, semicolon or tab.">
            {(id) => (
              <textarea
                id={id}
                rows={5}
                {...register('readingsCsv')}
                placeholder={'L*,a*,b*\n24.62,2.05,-21.18\n24.71,2.20,-21.02'}
                className="figures block w-full rounded-md border border-rule-strong bg-panel px-2.5 py-1.5 text-xs text-ink shadow-xs focus:border-spruce-500 focus:outline-none focus:ring-2 focus:ring-spruce-100"
              />
            )}
          </Field>
          <label className="inline-flex cursor-pointer items-center gap-2 text-xs text-spruce-700 hover:underline">
            <input type="file" accept=".csv,.txt,text/csv,text/plain" className="sr-only" onChange={(e) => void onFile(e.target.files?.[0])} />
            Load a CSV file from the instrument
          </label>
          {readingsNote ? <p className="figures text-2xs text-ink-faint">{readingsNote}</p> : null}
        </div>
      )}
      {preview && target && sample ? (
        <div className="flex items-center gap-3 rounded-md border border-rule bg-paper/50 px-3 py-2">
          <PairSwatch target={target.colour} sample={sample} />
          <p className="text-xs text-ink-soft">{preview.summary} ΔE00 {preview.deltaE2000.toFixed(2)}.</p>
        </div>
      ) : null}
      <Field label="Comment" error={err('comment')}>
        {(id) => <Input id={id} {...register('comment')} placeholder="Recipe, substrate, anything the colour lead should know" />}
      </Field>
      <Field label="Photo of the dip (optional)" error={err('photoFileId')} hint="JPEG or PNG, under daylight, beside the standard if you have it.">
        {(id) => (
          <input
            key={photoKey}
            id={id}
            type="file"
            accept="image/jpeg,image/png,image/webp"
            onChange={(e) => setPhoto(e.target.files?.[0] ?? null)}
            className="block w-full text-xs text-ink-soft file:mr-3 file:h-8 file:rounded-md file:border file:border-rule-strong file:bg-panel file:px-3 file:text-xs file:font-medium file:text-ink hover:file:bg-paper"
          />
        )}
      </Field>
      <Button type="submit" variant="primary" disabled={formState.isSubmitting}>{formState.isSubmitting ? 'Sending…' : 'Send lab dip'}</Button>
    </form>
  );
}
