'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { api, ApiError } from '@/lib/api/client';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/card';
import { Field, Select } from '@/components/ui/field';

function message(err: unknown, fallback: string) {
  if (!(err instanceof ApiError)) return fallback;
  const f = Object.values(err.fieldErrors).flat();
  return f.length ? f.join(' ') : err.message;
}

/** Comment on a released revision; a client asked to review it also approves or asks for changes. */
export function ReviewActions({ releaseId, canDecide, canComment }: { releaseId: string; canDecide: boolean; canComment: boolean }) {
  const router = useRouter();
  const [body, setBody] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [note, setNote] = useState<string | null>(null);
  const act = async (fn: () => Promise<unknown>, done: string) => {
    setError(null);
    setNote(null);
    try {
      await fn();
      setBody('');
      setNote(done);
      router.refresh();
    } catch (err) {
      setError(message(err, 'That did not go through.'));
    }
  };
  if (!canDecide && !canComment) return null;
  return (
    <div className="space-y-2">
      <Field label={canDecide ? 'Comment (say what should change when you ask for changes)' : 'Comment'}>
        {(id) => <textarea id={id} value={body} onChange={(e) => setBody(e.target.value)} rows={3} maxLength={4000} className="block w-full rounded-md border border-rule-strong bg-panel px-2.5 py-1.5 text-sm" />}
      </Field>
      <div className="flex flex-wrap gap-2">
        {canComment ? <Button disabled={!body.trim()} onClick={() => act(() => api(`/api/releases/${releaseId}/comments`, { method: 'POST', json: { body } }), 'Comment added.')}>Comment</Button> : null}
        {canDecide ? (
          <>
            <Button variant="primary" onClick={() => act(() => api(`/api/releases/${releaseId}/decision`, { method: 'POST', json: { decision: 'approved', comment: body } }), 'Approved. The studio was told.')}>Approve this revision</Button>
            <Button variant="danger" onClick={() => act(() => api(`/api/releases/${releaseId}/decision`, { method: 'POST', json: { decision: 'changes-requested', comment: body } }), 'Changes asked. The studio was told.')}>Ask for changes</Button>
          </>
        ) : null}
      </div>
      {error ? <Notice tone="error">{error}</Notice> : null}
      {note ? <Notice>{note}</Notice> : null}
    </div>
  );
}

/** Ask a client of the studio to approve the released revision. */
export function AskForReview({ releaseId, clients }: { releaseId: string; clients: { id: string; name: string }[] }) {
  const router = useRouter();
  const [pick, setPick] = useState(clients[0]?.id ?? '');
  const [note, setNote] = useState<string | null>(null);
  return (
    <div className="flex flex-wrap items-end gap-2">
      <Field label="Client" className="w-64">
        {(id) => (
          <Select id={id} value={pick} onChange={(e) => setPick(e.target.value)}>
            {clients.map((c) => <option key={c.id} value={c.id}>{c.name}</option>)}
          </Select>
        )}
      </Field>
      <Button
        disabled={!pick}
        onClick={async () => {
          try {
            await api(`/api/releases/${releaseId}/reviews`, { method: 'POST', json: { clientId: pick } });
            setNote('Asked; the client was e-mailed the link.');
            router.refresh();
          } catch (err) {
            setNote(message(err, 'That did not go through.'));
          }
        }}
      >
        Ask to approve
      </Button>
      {note ? <span className="text-sm text-ink-soft" role="status">{note}</span> : null}
    </div>
  );
}
