'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { api, ApiError } from '@/lib/api/client';
import type { TestKnit } from '@/lib/db/test-knits';
import { Button } from '@/components/ui/button';
import { Card, Notice } from '@/components/ui/card';
import { Field, Input } from '@/components/ui/field';

const statusWords: Record<TestKnit['status'], string> = {
  requested: 'To knit',
  knitted: 'Knitted: waiting for the studio',
  approved: 'Approved',
  'change-requested': 'Change asked',
};
const statusTone: Record<TestKnit['status'], string> = {
  requested: 'bg-rule/70 text-ink-soft',
  knitted: 'bg-ochre-50 text-ochre-700',
  approved: 'bg-spruce-50 text-spruce-700',
  'change-requested': 'bg-madder-50 text-madder-700',
};

function message(err: unknown, fallback: string): string {
  if (!(err instanceof ApiError)) return fallback;
  const fields = Object.values(err.fieldErrors).flat();
  return fields.length ? fields.join(' ') : err.message;
}

/** One-click request of a test knit of every texture of a release. */
export function RequestTestKnits({ releaseId, revision }: { releaseId: string; revision: number }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [note, setNote] = useState<string | null>(null);
  return (
    <div className="flex flex-wrap items-center gap-3">
      <Button
        variant="primary"
        disabled={busy}
        onClick={async () => {
          setBusy(true);
          try {
            const r = await api<{ created: number }>(`/api/releases/${releaseId}/test-knits`, { method: 'POST' });
            setNote(r.created ? `Requested ${r.created} test knit${r.created === 1 ? '' : 's'}; the mill was e-mailed.` : 'Every texture was requested already.');
            router.refresh();
          } catch (err) {
            setNote(message(err, 'The request did not go through.'));
          } finally {
            setBusy(false);
          }
        }}
      >
        Request test knits of every texture (revision {revision})
      </Button>
      {note ? <span className="text-sm text-ink-soft" role="status">{note}</span> : null}
    </div>
  );
}

function Figures({ k }: { k: TestKnit }) {
  const rows = [
    { label: 'Wales/cm', planned: k.planned.walesPerCm, measured: k.measured?.walesPerCm ?? null, d: k.deviation?.figures.find((f) => f.figure === 'walesPerCm') },
    { label: 'Courses/cm', planned: k.planned.coursesPerCm, measured: k.measured?.coursesPerCm ?? null, d: k.deviation?.figures.find((f) => f.figure === 'coursesPerCm') },
    { label: 'g/m²', planned: k.planned.gsm, measured: k.measured?.gsm ?? null, d: k.deviation?.figures.find((f) => f.figure === 'gsm') },
  ];
  return (
    <table className="figures text-sm">
      <thead className="text-xs text-ink-faint"><tr><th className="pr-4 text-left font-medium" /><th className="pr-4 text-right font-medium">Plan</th><th className="pr-4 text-right font-medium">Measured</th><th className="text-right font-medium">Deviation</th></tr></thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.label}>
            <td className="pr-4 text-ink-soft">{r.label}</td>
            <td className="pr-4 text-right">{r.planned === null ? '—' : r.planned.toFixed(1)}</td>
            <td className="pr-4 text-right">{r.measured === null ? '—' : r.measured.toFixed(1)}</td>
            <td className={`text-right ${r.d?.flagged ? 'font-semibold text-madder-700' : ''}`}>
              {r.d ? `${r.d.percent >= 0 ? '+' : ''}${r.d.percent.toFixed(1)} %${r.d.flagged ? ' ⚑' : ''}` : '—'}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function MillUpload({ k }: { k: TestKnit }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const submit = async (e: React.FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    setBusy(true);
    setError(null);
    try {
      const res = await fetch(`/api/test-knits/${k.id}/submission`, { method: 'POST', body: new FormData(e.currentTarget) });
      const body = (await res.json().catch(() => ({}))) as { error?: string; fieldErrors?: Record<string, string[]> };
      if (!res.ok) throw new ApiError(res.status, body.error ?? 'The upload did not go through.', body.fieldErrors ?? {});
      router.refresh();
    } catch (err) {
      setError(message(err, 'The upload did not go through.'));
    } finally {
      setBusy(false);
    }
  };
  return (
    <form onSubmit={submit} className="mt-3 grid grid-cols-2 gap-3 rounded-md border border-rule bg-paper p-3 md:grid-cols-5" aria-label={`Send the test knit of ${k.textureName}`}>
      <Field label="Photo (PNG, JPEG or WebP, up to 10 MB)" className="col-span-2">
        {(id) => <input id={id} name="photo" type="file" accept="image/png,image/jpeg,image/webp" required className="block w-full text-sm" />}
      </Field>
      <Field label="Wales per cm">{(id) => <Input id={id} name="walesPerCm" inputMode="decimal" required />}</Field>
      <Field label="Courses per cm">{(id) => <Input id={id} name="coursesPerCm" inputMode="decimal" required />}</Field>
      <Field label="g/m²">{(id) => <Input id={id} name="gsm" inputMode="decimal" required />}</Field>
      <Field label="Note (optional)" className="col-span-2 md:col-span-4">{(id) => <Input id={id} name="note" maxLength={2000} />}</Field>
      <div className="flex items-end"><Button type="submit" variant="primary" disabled={busy}>{busy ? 'Sending…' : 'Send test knit'}</Button></div>
      {error ? <div className="col-span-full"><Notice tone="error">{error}</Notice></div> : null}
    </form>
  );
}

function Decide({ k }: { k: TestKnit }) {
  const router = useRouter();
  const [comment, setComment] = useState('');
  const [error, setError] = useState<string | null>(null);
  const decide = async (decision: 'approved' | 'change-requested') => {
    setError(null);
    try {
      await api(`/api/test-knits/${k.id}/decision`, { method: 'POST', json: { version: k.version, decision, comment } });
      router.refresh();
    } catch (err) {
      setError(message(err, 'The decision did not go through.'));
    }
  };
  return (
    <div className="mt-3 flex flex-wrap items-end gap-2">
      <Field label="Comment to the mill" className="min-w-64 flex-1">{(id) => <Input id={id} value={comment} onChange={(e) => setComment(e.target.value)} maxLength={4000} />}</Field>
      <Button variant="primary" onClick={() => decide('approved')}>Approve</Button>
      <Button variant="danger" onClick={() => decide('change-requested')}>Ask for a change</Button>
      {error ? <div className="w-full"><Notice tone="error">{error}</Notice></div> : null}
    </div>
  );
}

/** Test knits grouped by revision and mill: the mill sends, the studio decides. */
export function TestKnitList({ knits, canSubmit, canDecide, thresholdPct }: { knits: TestKnit[]; canSubmit: boolean; canDecide: boolean; thresholdPct: number }) {
  if (!knits.length) return <Card title="Test knits"><p className="text-sm text-ink-soft">No test knits requested yet.</p></Card>;
  const groups = new Map<string, TestKnit[]>();
  for (const k of knits) {
    const key = `Revision ${k.revision} · ${k.millName}`;
    groups.set(key, [...(groups.get(key) ?? []), k]);
  }
  return (
    <div className="space-y-5">
      {[...groups.entries()].map(([title, list]) => (
        <Card key={title} title={title} actions={<span className="text-xs text-ink-faint">Flagged past ±{thresholdPct} %</span>}>
          <ul className="divide-y divide-rule">
            {list.map((k) => (
              <li key={k.id} className="py-3" data-testid={`test-knit-${k.textureName}`}>
                <div className="flex flex-wrap items-start gap-5">
                  <div className="min-w-56">
                    <div className="font-medium">{k.textureName}</div>
                    <span className={`mt-1 inline-block rounded-full px-2 py-0.5 text-xs font-medium ${statusTone[k.status]}`}>{statusWords[k.status]}</span>
                    {k.flagged ? <span className="ml-2 text-xs font-semibold text-madder-700">Off plan</span> : null}
                    {k.decisionComment ? <p className="mt-1 max-w-xs text-xs text-ink-soft">“{k.decisionComment}” — {k.decidedBy}</p> : null}
                    {k.millNote ? <p className="mt-1 max-w-xs text-xs text-ink-soft">Mill: {k.millNote}</p> : null}
                  </div>
                  <Figures k={k} />
                  {k.photoFileId ? (
                    // eslint-disable-next-line @next/next/no-img-element
                    <a href={`/api/files/${k.photoFileId}`}><img src={`/api/files/${k.photoFileId}`} alt={`Test knit of ${k.textureName}`} className="h-24 w-32 rounded border border-rule object-cover" /></a>
                  ) : null}
                </div>
                {canSubmit && (k.status === 'requested' || k.status === 'change-requested' || k.status === 'knitted') ? <MillUpload k={k} /> : null}
                {canDecide && k.status === 'knitted' ? <Decide k={k} /> : null}
              </li>
            ))}
          </ul>
        </Card>
      ))}
    </div>
  );
}
