'use client';

import { useMemo, useState } from 'react';
import { useForm, useWatch, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { api, ApiError } from '@/lib/api/client';
import type { FitDocument, SampleCorrection, SampleRound } from '@/lib/db/fit';
import { resolvePoint } from '@/lib/fit/grading';
import { pointsOfMeasure, type PointKey } from '@/lib/fit/points';
import { deviationOf, sampleRoundKindLabels, sampleRoundKinds, type DeviationStatus } from '@/lib/fit/sample-round';
import type { SizeSpec } from '@/lib/fit/spec';
import { formatLength, parseLengthCm, type LengthUnit } from '@/lib/fit/units';
import { Card, Notice } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { len, signedLen } from './format';
import { PhotoThumbnails, RoundPhotos } from './round-photos';

const deviationTone: Record<DeviationStatus, string> = {
  within: 'text-spruce-700',
  near: 'bg-ochre-50 text-ochre-700',
  outside: 'bg-madder-50 font-semibold text-madder-700',
  'no-spec': 'text-ink-faint',
};
const deviationWord: Record<DeviationStatus, string> = { within: 'in tolerance', near: 'near the limit', outside: 'out of tolerance', 'no-spec': 'no spec' };

/** Deviation against ± tolerance on a small scale of ± twice the tolerance. */
function DeviationBar({ deviationCm, toleranceCm, status }: { deviationCm: number | null; toleranceCm: number; status: DeviationStatus }) {
  if (deviationCm === null || !(toleranceCm > 0)) return null;
  const w = 64;
  const span = 2 * toleranceCm;
  const x = (cm: number) => w / 2 + (Math.max(-span, Math.min(span, cm)) / span) * (w / 2 - 2);
  const fill = status === 'outside' ? 'var(--color-madder-500)' : status === 'near' ? 'var(--color-ochre-500)' : 'var(--color-spruce-600)';
  return (
    <svg width={w} height={10} viewBox={`0 0 ${w} 10`} aria-hidden className="inline-block align-middle">
      <rect x={x(-toleranceCm)} y={2} width={x(toleranceCm) - x(-toleranceCm)} height={6} fill="var(--color-spruce-100)" />
      <line x1={w / 2} x2={w / 2} y1={0} y2={10} stroke="var(--color-rule-strong)" strokeWidth={1} />
      <circle cx={x(deviationCm)} cy={5} r={2.6} fill={fill} />
    </svg>
  );
}

const roundTitle = (r: SampleRound) => `Round ${r.roundNo} · ${sampleRoundKindLabels[r.kind]} · ${r.size}`;

/**
 * After a 409 the page takes the newer version, so the next try carries it; what was typed stays
 * in the form. Other errors just say what happened.
 */
async function failure(err: unknown, styleId: string, onDoc: (doc: FitDocument) => void): Promise<string> {
  if (err instanceof ApiError && err.status === 409) {
    try {
      onDoc((await api<{ fit: FitDocument }>(`/api/styles/${styleId}/fit`)).fit);
      return 'Someone saved this style after you opened it: the page now shows the latest version. What you entered is still here; check it and try again.';
    } catch {
      return err.message;
    }
  }
  return errorText(err);
}

function errorText(err: unknown): string {
  if (err instanceof ApiError) {
    const detail = Object.entries(err.fieldErrors).map(([k, v]) => `${k}: ${v[0]}`).join('; ');
    return detail ? `${err.message} ${detail}` : err.message;
  }
  return err instanceof Error ? err.message : 'Something went wrong.';
}

/** Sample rounds: record one, see its deviations against tolerance, comment, propose and decide corrections, compare rounds. */
export function SampleRoundsCard({
  doc, spec, unit, readOnly, blocked, onDoc,
}: {
  doc: FitDocument;
  spec: SizeSpec;
  unit: LengthUnit;
  readOnly: boolean;
  /** Why writes are paused (unsaved spec changes), or null. */
  blocked: string | null;
  onDoc: (doc: FitDocument) => void;
}) {
  const [mode, setMode] = useState<'round' | 'record' | 'compare'>('round');
  const [selected, setSelected] = useState<string | null>(doc.rounds.at(-1)?.id ?? null);
  const round = doc.rounds.find((r) => r.id === selected) ?? doc.rounds.at(-1) ?? null;
  const points = spec.points.map((p) => p.point);
  return (
    <Card
      title="Sample rounds"
      actions={
        <div className="flex flex-wrap items-center justify-end gap-1" role="tablist" aria-label="Sample round view">
          {doc.rounds.map((r) => (
            <Button key={r.id} size="sm" role="tab" aria-selected={mode === 'round' && round?.id === r.id} variant={mode === 'round' && round?.id === r.id ? 'primary' : 'ghost'} onClick={() => { setSelected(r.id); setMode('round'); }}>
              R{r.roundNo} {sampleRoundKindLabels[r.kind]}
            </Button>
          ))}
          {doc.rounds.length > 0 ? (
            <Button size="sm" role="tab" aria-selected={mode === 'compare'} variant={mode === 'compare' ? 'primary' : 'ghost'} onClick={() => setMode('compare')}>Compare</Button>
          ) : null}
          {readOnly ? null : (
            <Button size="sm" role="tab" aria-selected={mode === 'record'} variant={mode === 'record' ? 'primary' : 'secondary'} onClick={() => setMode('record')}>Record a round</Button>
          )}
        </div>
      }
    >
      {blocked && !readOnly ? <div className="mb-3"><Notice tone="warn">{blocked}</Notice></div> : null}
      {mode === 'record' && !readOnly ? (
        <RoundForm doc={doc} points={points} unit={unit} disabled={!!blocked} onDone={(d, id) => { onDoc(d); setSelected(id); setMode('round'); }} onDoc={onDoc} />
      ) : mode === 'compare' ? (
        <CompareRounds doc={doc} spec={spec} unit={unit} />
      ) : round ? (
        <RoundView key={round.id} doc={doc} round={round} spec={spec} unit={unit} readOnly={readOnly} disabled={!!blocked} onDoc={onDoc} />
      ) : (
        <p className="text-sm text-ink-soft">No sample round recorded yet.{readOnly ? '' : ' When a proto, fit or pre-production sample comes back, record what it measured: each point is held against the spec and its tolerance.'}</p>
      )}
    </Card>
  );
}

// ---------------------------------------------------------------------------------------------

function roundFormSchema(unit: LengthUnit) {
  return z
    .object({
      kind: z.enum(sampleRoundKinds),
      size: z.string().min(1, 'Choose the sample size'),
      receivedOn: z.string().regex(/^$|^\d{4}-\d{2}-\d{2}$/, 'A date like 2027-03-14'),
      notes: z.string().max(4000, 'At most 4000 characters'),
      measurements: z.record(z.string(), z.string()),
    })
    .superRefine((v, ctx) => {
      for (const [point, raw] of Object.entries(v.measurements)) {
        const cm = parseLengthCm(raw, unit);
        if (cm === null) continue;
        if (Number.isNaN(cm)) ctx.addIssue({ code: 'custom', path: ['measurements', point], message: 'Not a number' });
        else if (cm <= 0) ctx.addIssue({ code: 'custom', path: ['measurements', point], message: 'Must be above zero' });
      }
    });
}
type RoundForm = z.infer<ReturnType<typeof roundFormSchema>>;

/**
 * Records a new round, or (given `round`) changes one: its details and measurements. Beside each
 * point it shows the spec the sample is held against and, as a value is typed, its deviation. On
 * an edit, values left as they were shown are sent as stored, so nothing moves by rounding.
 */
function RoundForm({ doc, round, points, unit, disabled, onDone, onCancel, onDoc }: {
  doc: FitDocument; round?: SampleRound; points: PointKey[]; unit: LengthUnit; disabled: boolean;
  onDone: (doc: FitDocument, roundId: string) => void; onCancel?: () => void; onDoc: (doc: FitDocument) => void;
}) {
  const [serverError, setServerError] = useState<string | null>(null);
  const schema = useMemo(() => roundFormSchema(unit), [unit]);
  const shown = useMemo(
    () => Object.fromEntries(points.map((p) => [p, formatLength(round?.measurements.find((m) => m.point === p)?.measuredCm, unit)])),
    [points, round, unit],
  );
  const form = useForm<RoundForm>({
    resolver: zodResolver(schema) as Resolver<RoundForm>,
    defaultValues: round
      ? { kind: round.kind, size: round.size, receivedOn: round.receivedOn ?? '', notes: round.notes, measurements: shown }
      : { kind: doc.rounds.length === 0 ? 'proto' : 'fit', size: doc.spec.baseSize, receivedOn: '', notes: '', measurements: shown },
  });
  const { register, handleSubmit, control, formState: { errors, isSubmitting }, setError } = form;
  const size = useWatch({ control, name: 'size' });
  const typed = useWatch({ control, name: 'measurements' });
  /** The spec and tolerance a point is held against: the one it was recorded with, or today's. */
  const heldAgainst = (point: PointKey): { specCm: number | null; toleranceCm: number } | null => {
    const kept = round && size === round.size ? round.measurements.find((m) => m.point === point) : undefined;
    if (kept) return { specCm: kept.specCm, toleranceCm: kept.toleranceCm };
    const p = doc.spec.points.find((x) => x.point === point);
    return p ? { specCm: resolvePoint(p, doc.sizes, doc.spec.baseSize)[size]?.valueCm ?? null, toleranceCm: p.toleranceCm } : null;
  };
  const onSubmit = handleSubmit(async (v) => {
    setServerError(null);
    const measurements = Object.fromEntries(
      Object.entries(v.measurements).flatMap(([p, raw]) => {
        const stored = round?.measurements.find((m) => m.point === p);
        if (stored && raw === shown[p]) return [[p, stored.measuredCm]];
        const cm = parseLengthCm(raw, unit);
        return cm === null || Number.isNaN(cm) ? [] : [[p, cm]];
      }),
    );
    const body = { version: doc.version, kind: v.kind, size: v.size, receivedOn: v.receivedOn || null, notes: v.notes, measurements };
    try {
      if (round) {
        onDone((await api<{ fit: FitDocument }>(`/api/styles/${doc.styleId}/fit/rounds/${round.id}`, { method: 'PATCH', json: body })).fit, round.id);
      } else {
        const res = await api<{ round: SampleRound; fit: FitDocument }>(`/api/styles/${doc.styleId}/fit/rounds`, { method: 'POST', json: body });
        onDone(res.fit, res.round.id);
      }
    } catch (err) {
      if (err instanceof ApiError) {
        for (const [path, msgs] of Object.entries(err.fieldErrors)) setError(path as keyof RoundForm, { message: msgs[0] });
      }
      setServerError(await failure(err, doc.styleId, onDoc));
    }
  });
  return (
    <form onSubmit={onSubmit} className="space-y-3" aria-label={round ? `Edit round ${round.roundNo}` : 'Record a sample round'}>
      <div className="grid grid-cols-2 gap-3 md:grid-cols-4">
        <Field label="Kind" error={errors.kind?.message}>
          {(id) => (
            <Select id={id} {...register('kind')}>
              {sampleRoundKinds.map((k) => <option key={k} value={k}>{sampleRoundKindLabels[k]}</option>)}
            </Select>
          )}
        </Field>
        <Field label="Sample size" error={errors.size?.message}>
          {(id) => <Select id={id} {...register('size')}>{doc.sizes.map((s) => <option key={s} value={s}>{s}</option>)}</Select>}
        </Field>
        <Field label="Received on" error={errors.receivedOn?.message}>
          {(id) => <Input id={id} type="date" {...register('receivedOn')} />}
        </Field>
      </div>
      <div>
        <div className="mb-1 text-xs font-medium text-ink-soft">Measured, flat and relaxed ({unit}) · size {size}</div>
        <div className="grid grid-cols-2 gap-x-3 gap-y-2 md:grid-cols-4">
          {points.map((p) => {
            const held = heldAgainst(p);
            const cm = parseLengthCm(typed?.[p] ?? '', unit);
            const d = held && cm !== null && !Number.isNaN(cm) && cm > 0 ? deviationOf(cm, held.specCm, held.toleranceCm) : null;
            return (
              <Field key={p} label={pointsOfMeasure[p].label} error={errors.measurements?.[p]?.message}>
                {(id) => (
                  <>
                    <Input id={id} inputMode="decimal" className="figures text-right" aria-invalid={!!errors.measurements?.[p]} {...register(`measurements.${p}`)} />
                    <p className="figures flex justify-between gap-2 text-2xs text-ink-faint" data-testid={`held-${p}`}>
                      <span>{held?.specCm !== null && held?.specCm !== undefined ? `spec ${len(held.specCm, unit)} ± ${formatLength(held.toleranceCm, unit)}` : 'no spec'}</span>
                      {d && d.deviationCm !== null ? <span className={`rounded px-0.5 ${deviationTone[d.status]}`}>{signedLen(d.deviationCm, unit)}</span> : null}
                    </p>
                  </>
                )}
              </Field>
            );
          })}
        </div>
      </div>
      <Field label="Notes" error={errors.notes?.message}>
        {(id) => <textarea id={id} rows={2} className="block w-full rounded-md border border-rule-strong bg-panel px-2.5 py-1.5 text-sm" {...register('notes')} />}
      </Field>
      {serverError ? <Notice tone="error">{serverError}</Notice> : null}
      <div className="flex justify-end gap-2">
        {onCancel ? <Button type="button" variant="ghost" onClick={onCancel}>Cancel</Button> : null}
        <Button type="submit" variant="primary" disabled={disabled || isSubmitting}>
          {round ? (isSubmitting ? 'Saving…' : 'Save round') : isSubmitting ? 'Recording…' : 'Record round'}
        </Button>
      </div>
    </form>
  );
}

// ---------------------------------------------------------------------------------------------

function RoundView({ doc, round, spec, unit, readOnly, disabled, onDoc }: {
  doc: FitDocument; round: SampleRound; spec: SizeSpec; unit: LengthUnit; readOnly: boolean; disabled: boolean; onDoc: (doc: FitDocument) => void;
}) {
  const [correcting, setCorrecting] = useState<PointKey | null>(null);
  const [deleting, setDeleting] = useState(false);
  const [editing, setEditing] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const specNow = (point: PointKey, size: string) => {
    const p = spec.points.find((x) => x.point === point);
    return p ? resolvePoint(p, doc.sizes, spec.baseSize)[size]?.valueCm ?? null : null;
  };
  const run = async (fn: () => Promise<{ fit: FitDocument }>) => {
    setError(null);
    setBusy(true);
    try {
      onDoc((await fn()).fit);
      return true;
    } catch (err) {
      setError(await failure(err, doc.styleId, onDoc));
      return false;
    } finally {
      setBusy(false);
    }
  };
  const decide = (c: SampleCorrection, decision: 'accept' | 'reject') =>
    run(() => api(`/api/styles/${doc.styleId}/fit/rounds/${round.id}/corrections/${c.id}`, { method: 'PATCH', json: { version: doc.version, decision } }));
  const outside = round.measurements.filter((m) => deviationOf(m.measuredCm, m.specCm, m.toleranceCm).status === 'outside').length;
  return (
    <div className="space-y-3" data-testid="sample-round">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="text-sm font-semibold">{roundTitle(round)}</h3>
        <div className="flex items-baseline gap-3 text-xs text-ink-soft">
          <span>
            {round.receivedOn ? <>received <span className="figures">{round.receivedOn}</span> · </> : null}
            recorded by {round.createdBy ?? '—'} · <span className={outside ? 'font-semibold text-madder-700' : 'text-spruce-700'}>{outside} of {round.measurements.length} out of tolerance</span>
          </span>
          {readOnly ? null : (
            <span className="flex gap-1">
              <Button size="sm" variant="ghost" aria-pressed={editing} disabled={disabled && !editing} title={disabled ? 'Save or discard the spec first' : undefined} onClick={() => { setEditing(!editing); setDeleting(false); }}>Edit round</Button>
              <Button size="sm" variant="ghost" className="text-madder-700" aria-expanded={deleting} onClick={() => { setDeleting(!deleting); setEditing(false); }}>Delete round…</Button>
            </span>
          )}
        </div>
      </div>
      {deleting && !readOnly ? (
        <DeleteRound doc={doc} round={round} unit={unit} onCancel={() => setDeleting(false)} onDoc={onDoc} />
      ) : null}
      {editing && !readOnly ? (
        <div className="rounded-md border border-rule bg-paper/60 p-3">
          <RoundForm
            doc={doc}
            round={round}
            points={[...new Set([...spec.points.map((p) => p.point), ...round.measurements.map((m) => m.point)])]}
            unit={unit}
            disabled={disabled}
            onDone={(d) => { onDoc(d); setEditing(false); }}
            onCancel={() => setEditing(false)}
            onDoc={onDoc}
          />
        </div>
      ) : null}
      {round.notes && !editing ? <p className="whitespace-pre-wrap text-sm text-ink-soft">{round.notes}</p> : null}
      <table className="w-full border-separate border-spacing-0 text-sm">
        <thead className="text-xs text-ink-soft">
          <tr>
            <th className="border-b border-rule-strong bg-paper px-2 py-1.5 text-left font-medium">Point</th>
            <th className="border-b border-rule-strong bg-paper px-2 text-right font-medium" title="The spec the sample was held against when it was recorded">Spec then</th>
            <th className="border-b border-rule-strong bg-paper px-2 text-right font-medium">Tol. ±</th>
            <th className="border-b border-rule-strong bg-paper px-2 text-right font-medium">Measured</th>
            <th className="border-b border-rule-strong bg-paper px-2 text-right font-medium">Deviation</th>
            <th className="border-b border-rule-strong bg-paper px-1 text-center font-normal text-ink-faint" title="The shaded band is ± tolerance; the scale runs to twice it">± tol.</th>
            <th className="border-b border-rule-strong bg-paper px-2 text-right font-medium">Spec now</th>
            <th className="border-b border-rule-strong bg-paper px-2" />
          </tr>
        </thead>
        <tbody className="figures">
          {round.measurements.map((m) => {
            const d = deviationOf(m.measuredCm, m.specCm, m.toleranceCm);
            const now = specNow(m.point, round.size);
            return (
              <tr key={m.point} data-testid={`deviation-${m.point}`} data-status={d.status}>
                <th scope="row" className="border-b border-rule px-2 py-1 text-left font-sans text-[13px] font-medium">{pointsOfMeasure[m.point].label}</th>
                <td className="border-b border-rule px-2 text-right">{len(m.specCm, unit)}</td>
                <td className="border-b border-rule px-2 text-right text-ink-soft">{formatLength(m.toleranceCm, unit)}</td>
                <td className="border-b border-rule px-2 text-right">{len(m.measuredCm, unit)}</td>
                <td className={`whitespace-nowrap border-b border-rule px-2 text-right ${deviationTone[d.status]}`} title={deviationWord[d.status]}>
                  {signedLen(d.deviationCm, unit)} <span className="inline-block w-7 text-left font-sans text-2xs font-normal">{d.status === 'outside' ? 'out' : d.status === 'near' ? 'near' : ''}</span>
                </td>
                <td className="border-b border-rule px-1 text-center"><DeviationBar deviationCm={d.deviationCm} toleranceCm={m.toleranceCm} status={d.status} /></td>
                <td className={`border-b border-rule px-2 text-right ${now !== m.specCm ? 'font-semibold text-indigo-thread' : 'text-ink-soft'}`}>{len(now, unit)}</td>
                <td className="border-b border-rule px-2 text-right font-sans">
                  {readOnly ? null : (
                    <Button size="sm" variant="ghost" disabled={disabled} onClick={() => setCorrecting(correcting === m.point ? null : m.point)} aria-label={`Correct ${pointsOfMeasure[m.point].label.toLowerCase()}`}>
                      Correct…
                    </Button>
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {correcting && !readOnly ? (
        <ProposeCorrection
          key={correcting}
          point={correcting}
          size={round.size}
          currentCm={specNow(correcting, round.size)}
          unit={unit}
          busy={busy || disabled}
          onCancel={() => setCorrecting(null)}
          onPropose={async (body) => {
            const ok = await run(() => api(`/api/styles/${doc.styleId}/fit/rounds/${round.id}/corrections`, { method: 'POST', json: { version: doc.version, ...body } }));
            if (ok) setCorrecting(null);
          }}
        />
      ) : null}
      {error ? <Notice tone="error">{error}</Notice> : null}

      <RoundPhotos doc={doc} round={round} title={roundTitle(round)} readOnly={readOnly} onDoc={onDoc} />

      <section aria-label="Corrections">
        <h4 className="mb-1 text-xs font-semibold uppercase tracking-[0.06em] text-ink-soft">Corrections</h4>
        {round.corrections.length === 0 ? <p className="text-sm text-ink-faint">None proposed.</p> : (
          <ul className="divide-y divide-rule rounded-md border border-rule">
            {round.corrections.map((c) => (
              <li key={c.id} className="flex flex-wrap items-center gap-x-3 gap-y-1 px-2.5 py-1.5 text-sm" data-testid="correction" data-status={c.status}>
                <span className="font-medium">{pointsOfMeasure[c.point].label}</span>
                <span className="figures">{c.size}: {len(c.fromCm, unit) || '—'} → <strong>{len(c.toCm, unit)}</strong> {unit}</span>
                <span className="text-xs text-ink-soft">{c.scope === 'point' ? 'every size moves by the same amount' : 'this size only'}</span>
                {c.reason ? <span className="text-xs text-ink-soft">“{c.reason}”</span> : null}
                <span className="ml-auto flex items-center gap-2 text-xs">
                  {c.status === 'proposed' ? (
                    readOnly ? <span className="text-ochre-700">proposed by {c.proposedBy}</span> : (
                      <>
                        <span className="text-ink-faint">proposed by {c.proposedBy}</span>
                        <Button size="sm" variant="primary" disabled={busy || disabled} onClick={() => decide(c, 'accept')}>Accept</Button>
                        <Button size="sm" variant="ghost" disabled={busy || disabled} onClick={() => decide(c, 'reject')}>Reject</Button>
                      </>
                    )
                  ) : (
                    <span className={c.status === 'accepted' ? 'text-spruce-700' : 'text-ink-faint'}>
                      {c.status} by {c.decidedBy ?? '—'} <span className="figures">{c.decidedAt?.slice(0, 10)}</span>
                    </span>
                  )}
                </span>
              </li>
            ))}
          </ul>
        )}
      </section>

      <Comments doc={doc} round={round} readOnly={readOnly} onDoc={onDoc} />
    </div>
  );
}

/**
 * The confirmation before a round is deleted: what goes with it, and that the spec keeps the
 * changes of its accepted corrections. A 409 loads the newer version and asks again.
 */
function DeleteRound({ doc, round, unit, onCancel, onDoc }: {
  doc: FitDocument; round: SampleRound; unit: LengthUnit; onCancel: () => void; onDoc: (doc: FitDocument) => void;
}) {
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const accepted = round.corrections.filter((c) => c.status === 'accepted');
  const proposed = round.corrections.filter((c) => c.status === 'proposed').length;
  const n = (count: number, one: string) => (count ? [`${count} ${count === 1 ? one : `${one}s`}`] : []);
  const parts = [
    ...n(round.measurements.length, 'measurement'), ...n(round.comments.length, 'comment'), ...n(round.photos.length, 'photo'), ...n(round.corrections.length, 'correction'),
  ];
  const holds = parts.length > 1 ? `${parts.slice(0, -1).join(', ')} and ${parts.at(-1)}` : parts[0];
  const later = doc.rounds.filter((r) => r.roundNo > round.roundNo).map((r) => r.roundNo);
  const confirm = async () => {
    setBusy(true);
    setError(null);
    try {
      onDoc((await api<{ fit: FitDocument }>(`/api/styles/${doc.styleId}/fit/rounds/${round.id}?version=${doc.version}`, { method: 'DELETE' })).fit);
    } catch (err) {
      if (err instanceof ApiError && err.status === 409) {
        setError(`${await failure(err, doc.styleId, onDoc)} Check what the round holds now before you delete it.`);
      } else if (err instanceof ApiError && err.status === 404) {
        setError('This round is gone already: someone deleted it.');
        await api<{ fit: FitDocument }>(`/api/styles/${doc.styleId}/fit`).then((r) => onDoc(r.fit)).catch(() => {});
      } else setError(errorText(err));
    } finally {
      setBusy(false);
    }
  };
  return (
    <div role="alertdialog" aria-label={`Delete ${roundTitle(round)}`} className="space-y-1.5 rounded-md border border-madder-500/40 bg-madder-50 p-3 text-sm text-ink">
      <p className="font-semibold text-madder-700">Delete round {round.roundNo}?{holds ? ` Its ${holds} ${parts.length === 1 && holds.startsWith('1 ') ? 'is' : 'are'} deleted with it.` : ' It holds nothing else.'}</p>
      {accepted.length ? (
        <div>
          <p>The spec keeps what its accepted {accepted.length === 1 ? 'correction' : 'corrections'} changed (each has its own history entry):</p>
          <ul className="figures ml-4 list-disc text-xs">
            {accepted.map((c) => (
              <li key={c.id}><span className="font-sans">{pointsOfMeasure[c.point].label}</span> {c.size}: {len(c.fromCm, unit) || '—'} → {len(c.toCm, unit)} {unit}{c.scope === 'point' ? <span className="font-sans"> (every size)</span> : null}</li>
            ))}
          </ul>
          <p className="text-xs text-ink-soft">To undo a change, edit the size spec.</p>
        </div>
      ) : (
        <p>No correction of this round was accepted: the spec does not change.</p>
      )}
      {proposed ? <p>{proposed === 1 ? 'Its correction still waiting for a decision is' : `Its ${proposed} corrections still waiting for a decision are`} dropped.</p> : null}
      <p className="text-xs text-ink-soft">
        The deletion is recorded in the style&rsquo;s history.{later.length ? ` ${later.length === 1 ? `Round ${later[0]} keeps its number` : `Rounds ${later.join(', ')} keep their numbers`}.` : ''}
      </p>
      {error ? <p role="alert" className="text-xs text-madder-700">{error}</p> : null}
      <div className="flex gap-2 pt-1">
        <Button size="sm" variant="danger" className="border-madder-700! bg-madder-700! text-white! hover:bg-madder-500!" disabled={busy} onClick={confirm}>{busy ? 'Deleting…' : `Delete round ${round.roundNo}`}</Button>
        <Button size="sm" variant="ghost" disabled={busy} onClick={onCancel}>Keep it</Button>
      </div>
    </div>
  );
}

const correctionFormSchema = (unit: LengthUnit) =>
  z.object({
    to: z.string().refine((raw) => { const cm = parseLengthCm(raw, unit); return cm !== null && cm > 0; }, 'Enter the new spec value'),
    scope: z.enum(['size', 'point']),
    reason: z.string().max(1000, 'At most 1000 characters'),
  });
type CorrectionForm = z.infer<ReturnType<typeof correctionFormSchema>>;

function ProposeCorrection({ point, size, currentCm, unit, busy, onCancel, onPropose }: {
  point: PointKey; size: string; currentCm: number | null; unit: LengthUnit; busy: boolean;
  onCancel: () => void; onPropose: (body: { point: PointKey; size: string; toCm: number; scope: 'size' | 'point'; reason: string }) => void;
}) {
  const schema = useMemo(() => correctionFormSchema(unit), [unit]);
  const { register, handleSubmit, formState: { errors } } = useForm<CorrectionForm>({
    resolver: zodResolver(schema) as Resolver<CorrectionForm>,
    defaultValues: { to: formatLength(currentCm, unit), scope: 'point', reason: '' },
  });
  const label = pointsOfMeasure[point].label;
  return (
    <form
      aria-label={`Correct ${label.toLowerCase()}`}
      className="grid grid-cols-1 items-end gap-3 rounded-md border border-spruce-100 bg-spruce-50/60 p-3 md:grid-cols-[8rem_14rem_1fr_auto]"
      onSubmit={handleSubmit((v) => onPropose({ point, size, toCm: parseLengthCm(v.to, unit)!, scope: v.scope, reason: v.reason }))}
    >
      <Field label={`New ${label.toLowerCase()}, ${size} (${unit})`} error={errors.to?.message}>
        {(id) => <Input id={id} autoFocus inputMode="decimal" className="figures text-right" {...register('to')} />}
      </Field>
      <Field label="Apply to">
        {(id) => (
          <Select id={id} {...register('scope')}>
            <option value="point">Every size, by the same amount</option>
            <option value="size">Size {size} only</option>
          </Select>
        )}
      </Field>
      <Field label="Reason" error={errors.reason?.message}>
        {(id) => <Input id={id} {...register('reason')} />}
      </Field>
      <div className="flex gap-2">
        <Button type="button" variant="ghost" onClick={onCancel}>Cancel</Button>
        <Button type="submit" variant="primary" disabled={busy}>Propose</Button>
      </div>
    </form>
  );
}

const commentSchema = z.object({ body: z.string().trim().min(1, 'Write a comment').max(4000, 'At most 4000 characters') });
type CommentForm = z.infer<typeof commentSchema>;

function Comments({ doc, round, readOnly, onDoc }: { doc: FitDocument; round: SampleRound; readOnly: boolean; onDoc: (d: FitDocument) => void }) {
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, reset, formState: { errors, isSubmitting } } = useForm<CommentForm>({
    resolver: zodResolver(commentSchema) as Resolver<CommentForm>, defaultValues: { body: '' },
  });
  return (
    <section aria-label="Comments">
      <h4 className="mb-1 text-xs font-semibold uppercase tracking-[0.06em] text-ink-soft">Comments</h4>
      <ul className="space-y-1.5">
        {round.comments.map((c) => (
          <li key={c.id} className="rounded-md bg-paper px-2.5 py-1.5 text-sm">
            <div className="text-2xs text-ink-faint"><span className="font-medium text-ink-soft">{c.userName ?? '—'}</span> · <span className="figures">{c.createdAt.replace('T', ' ').slice(0, 16)}</span></div>
            <p className="whitespace-pre-wrap">{c.body}</p>
          </li>
        ))}
        {round.comments.length === 0 ? <li className="text-sm text-ink-faint">No comments yet.</li> : null}
      </ul>
      {readOnly ? null : (
        <form
          className="mt-2 flex items-start gap-2"
          onSubmit={handleSubmit(async (v) => {
            setError(null);
            try {
              const res = await api<{ fit: FitDocument }>(`/api/styles/${doc.styleId}/fit/rounds/${round.id}/comments`, { method: 'POST', json: { version: doc.version, body: v.body } });
              onDoc(res.fit);
              reset({ body: '' });
            } catch (err) {
              setError(await failure(err, doc.styleId, onDoc));
            }
          })}
        >
          <div className="flex-1">
            <textarea aria-label="Comment" rows={1} placeholder="Add a comment on this round…" className="block w-full rounded-md border border-rule-strong bg-panel px-2.5 py-1.5 text-sm" {...register('body')} />
            {errors.body ? <p role="alert" className="mt-1 text-xs text-madder-700">{errors.body.message}</p> : null}
            {error ? <p role="alert" className="mt-1 text-xs text-madder-700">{error}</p> : null}
          </div>
          <Button type="submit" disabled={isSubmitting}>Comment</Button>
        </form>
      )}
    </section>
  );
}

// ---------------------------------------------------------------------------------------------

function CompareRounds({ doc, spec, unit }: { doc: FitDocument; spec: SizeSpec; unit: LengthUnit }) {
  return (
    <div className="overflow-x-auto" data-testid="compare-rounds">
      <table className="w-full border-separate border-spacing-0 text-sm">
        <thead className="text-xs text-ink-soft">
          <tr>
            <th className="border-b border-rule-strong bg-paper px-2 py-1.5 text-left font-medium">Point</th>
            <th className="border-b border-rule-strong bg-paper px-2 text-right font-medium">Spec now ({spec.baseSize})</th>
            {doc.rounds.map((r) => (
              <th key={r.id} className="border-b border-l border-rule-strong bg-paper px-2 text-right font-medium">R{r.roundNo} {sampleRoundKindLabels[r.kind]} · {r.size}<div className="text-2xs font-normal text-ink-faint">spec then → measured (dev.)</div></th>
            ))}
            <th className="border-b border-l border-rule-strong bg-paper px-2 text-left font-medium">Corrections</th>
          </tr>
        </thead>
        <tbody className="figures">
          {doc.rounds.some((r) => r.photos.length) ? (
            <tr data-testid="compare-photos">
              <th scope="row" className="border-b border-rule px-2 py-1.5 text-left align-top font-sans text-[13px] font-medium">Photos</th>
              <td className="border-b border-rule" />
              {doc.rounds.map((r) => (
                <td key={r.id} className="border-b border-l border-rule px-2 py-1.5 align-top">
                  {r.photos.length ? <PhotoThumbnails title={roundTitle(r)} photos={r.photos} size={44} className="justify-end" /> : <span className="text-ink-faint">—</span>}
                </td>
              ))}
              <td className="border-b border-l border-rule" />
            </tr>
          ) : null}
          {spec.points.map((p) => {
            const now = resolvePoint(p, doc.sizes, spec.baseSize)[spec.baseSize]?.valueCm ?? null;
            const corrections = doc.rounds.flatMap((r) => r.corrections.filter((c) => c.point === p.point).map((c) => ({ r, c })));
            return (
              <tr key={p.point}>
                <th scope="row" className="border-b border-rule px-2 py-1 text-left font-sans text-[13px] font-medium">{pointsOfMeasure[p.point].label}</th>
                <td className="border-b border-rule px-2 text-right">{len(now, unit)}</td>
                {doc.rounds.map((r) => {
                  const m = r.measurements.find((x) => x.point === p.point);
                  if (!m) return <td key={r.id} className="border-b border-l border-rule px-2 text-right text-ink-faint">—</td>;
                  const d = deviationOf(m.measuredCm, m.specCm, m.toleranceCm);
                  return (
                    <td key={r.id} className="border-b border-l border-rule px-2 text-right">
                      <span className="text-ink-faint">{len(m.specCm, unit)} → </span>{len(m.measuredCm, unit)}{' '}
                      <span className={`rounded px-0.5 ${deviationTone[d.status]}`}>({signedLen(d.deviationCm, unit)})</span>
                    </td>
                  );
                })}
                <td className="border-b border-l border-rule px-2 font-sans text-xs text-ink-soft">
                  {corrections.map(({ r, c }) => (
                    <div key={c.id}>R{r.roundNo}: <span className="figures">{c.size} {len(c.fromCm, unit)} → {len(c.toCm, unit)}</span> <span className={c.status === 'accepted' ? 'text-spruce-700' : c.status === 'rejected' ? 'text-ink-faint line-through' : 'text-ochre-700'}>{c.status}</span></div>
                  ))}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
