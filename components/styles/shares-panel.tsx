'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { useQueryClient } from '@tanstack/react-query';
import type { Style } from '@/lib/db/styles';
import { api, ApiError } from '@/lib/api/client';
import { Card, Notice } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { Select } from '@/components/ui/field';
import { useOrganisations } from './use-styles';

export function SharesPanel({ style, canShare }: { style: Style; canShare: boolean }) {
  const router = useRouter();
  const qc = useQueryClient();
  const orgs = useOrganisations(canShare);
  const [pick, setPick] = useState('');
  const [error, setError] = useState<string | null>(null);
  const shared = new Set(style.shares.map((s) => s.organisationId));
  const options = (orgs.data ?? []).filter((o) => !shared.has(o.id));

  const act = async (fn: () => Promise<unknown>) => {
    setError(null);
    try {
      await fn();
      await qc.invalidateQueries({ queryKey: ['styles'] });
      router.refresh();
    } catch (err) {
      setError(err instanceof ApiError ? err.message : 'That did not work.');
    }
  };

  return (
    <Card title="Who outside the studio sees it">
      {error ? <div className="mb-3"><Notice tone="error">{error}</Notice></div> : null}
      {style.shares.length === 0 ? (
        <p className="text-sm text-ink-soft">Only your studio. Share it with a client for review or a mill for knitting.</p>
      ) : (
        <ul className="divide-y divide-rule text-sm">
          {style.shares.map((s) => (
            <li key={s.organisationId} className="flex items-center justify-between py-2">
              <span>
                <span className="font-medium">{s.name}</span>{' '}
                <span className="text-xs text-ink-faint">{s.kind === 'mill' ? 'Mill' : 'Client'}</span>
              </span>
              {canShare ? (
                <Button size="sm" variant="ghost" onClick={() => act(() => api(`/api/styles/${style.id}/shares/${s.organisationId}`, { method: 'DELETE' }))}>
                  Remove
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      )}
      {canShare ? (
        <div className="mt-3 flex gap-2">
          <Select aria-label="Share with" value={pick} onChange={(e) => setPick(e.target.value)}>
            <option value="">Share with…</option>
            {options.map((o) => <option key={o.id} value={o.id}>{o.name} ({o.kind === 'mill' ? 'mill' : 'client'})</option>)}
          </Select>
          <Button disabled={!pick} onClick={() => act(() => api(`/api/styles/${style.id}/shares`, { method: 'POST', json: { organisationId: pick } }).then(() => setPick('')))}>
            Share
          </Button>
        </div>
      ) : null}
    </Card>
  );
}
