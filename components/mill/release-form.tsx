'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { api, ApiError } from '@/lib/api/client';
import type { ReleaseResult } from '@/lib/db/releases';
import { Button } from '@/components/ui/button';
import { Card, Notice } from '@/components/ui/card';
import { Field } from '@/components/ui/field';

/** Release the style's current state to one or more mills (e-mails them a link). */
export function ReleaseForm({ styleId, version, revision, alreadyReleased, mills }: {
  styleId: string; version: number; revision: number; alreadyReleased: boolean; mills: { id: string; name: string; contacts: number }[];
}) {
  const router = useRouter();
  const [picked, setPicked] = useState<string[]>(mills[0] ? [mills[0].id] : []);
  const [note, setNote] = useState('');
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const next = alreadyReleased ? revision + 1 : revision;

  const release = async () => {
    setBusy(true);
    setError(null);
    setDone(null);
    try {
      const r = await api<ReleaseResult>(`/api/styles/${styleId}/releases`, { method: 'POST', json: { version, millIds: picked, note } });
      const mailed = r.mail.sent.length ? ` E-mailed ${r.mail.sent.length} contact${r.mail.sent.length === 1 ? '' : 's'}.` : '';
      const failed = r.mail.failed.length || r.mail.skipped ? ' Some e-mails could not be sent; the release itself is saved.' : '';
      setDone(`Revision ${r.release.revision} released.${mailed}${failed}`);
      router.refresh();
    } catch (err) {
      setError(err instanceof ApiError ? [err.message, ...Object.values(err.fieldErrors).flat()].join(' ') : 'The release did not go through.');
    } finally {
      setBusy(false);
    }
  };

  return (
    <Card title="Release to mills">
      <p className="mb-3 text-sm text-ink-soft">
        Freezes what the style is now as <span className="figures font-medium text-ink">revision {next}</span>: the mills get the pack as it is at this moment, and it stays viewable as released.
      </p>
      <fieldset className="mb-3 space-y-1.5">
        <legend className="mb-1 text-xs font-medium text-ink-soft">Mills</legend>
        {mills.map((m) => (
          <label key={m.id} className="flex items-center gap-2 text-sm">
            <input type="checkbox" checked={picked.includes(m.id)} onChange={(e) => setPicked((p) => (e.target.checked ? [...p, m.id] : p.filter((x) => x !== m.id)))} />
            {m.name} <span className="text-xs text-ink-faint">{m.contacts} contact{m.contacts === 1 ? '' : 's'}</span>
          </label>
        ))}
      </fieldset>
      <Field label="Note to the mills (optional)" className="mb-3">
        {(id) => <textarea id={id} value={note} onChange={(e) => setNote(e.target.value)} rows={2} maxLength={2000} className="block w-full rounded-md border border-rule-strong bg-panel px-2.5 py-1.5 text-sm" />}
      </Field>
      {error ? <div className="mb-2"><Notice tone="error">{error}</Notice></div> : null}
      {done ? <div className="mb-2"><Notice>{done}</Notice></div> : null}
      <Button variant="primary" disabled={busy || picked.length === 0} onClick={release}>
        {busy ? 'Releasing…' : `Release revision ${next}`}
      </Button>
    </Card>
  );
}
