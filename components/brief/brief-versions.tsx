'use client';

import { useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api/client';
import type { BriefVersion } from '@/lib/db/briefs';
import { briefFieldLabels } from '@/lib/validations/brief';
import { Notice } from '@/components/ui/card';
import { briefVersionsKey } from './use-brief';

/** An answer as the list shows it: blank as a dash, lists joined, the order by size as size and garments. */
function answerText(v: unknown): string {
  if (v === null || v === undefined || v === '') return '—';
  if (Array.isArray(v)) return v.length ? v.join(', ') : '—';
  if (typeof v === 'object') {
    const entries = Object.entries(v as Record<string, unknown>);
    return entries.length ? entries.map(([k, n]) => `${k} ${String(n)}`).join(', ') : '—';
  }
  return String(v);
}

/** The brief's earlier versions, newest first, with what each save changed. Studio staff only. */
export function BriefVersions({ styleId, initial }: { styleId: string; initial: BriefVersion[] }) {
  const versions = useQuery({
    queryKey: briefVersionsKey(styleId),
    initialData: initial,
    staleTime: 30_000,
    queryFn: () => api<{ versions: BriefVersion[] }>(`/api/styles/${styleId}/brief/versions`).then((r) => r.versions),
  });
  if (versions.error) return <Notice tone="error">{versions.error.message}</Notice>;
  const list = versions.data ?? [];
  if (!list.length) return <p className="text-sm text-ink-faint">No version saved yet.</p>;
  return (
    <ol className="space-y-2 text-sm" aria-label="Earlier versions of the brief">
      {list.map((v, i) => (
        <li key={v.version} className="rounded-md border border-rule px-3 py-2">
          <details>
            <summary className="cursor-pointer">
              <span className="font-medium">Version {v.version}</span>
              {i === 0 ? <span className="text-ink-faint"> (current)</span> : null}
              <span className="text-ink-soft"> · {new Date(v.savedAt).toLocaleString()}{v.savedBy ? ` · ${v.savedBy}` : ''}</span>
              <span className="block text-xs text-ink-faint">
                {v.version === 1 && !v.earlierUnknown
                  ? `The first version: ${v.changes.length} answer${v.changes.length === 1 ? '' : 's'} filled in`
                  : v.changes.length
                  ? `Changed: ${v.changes.map((c) => briefFieldLabels[c.field].toLowerCase()).join(', ')}`
                  : v.earlierUnknown ? 'The earliest version kept' : 'Saved with no change'}
              </span>
            </summary>
            {v.changes.length ? (
              <table className="mt-2 w-full text-xs">
                <thead><tr className="text-left text-ink-faint"><th className="pr-2 font-medium">Answer</th><th className="pr-2 font-medium">Before</th><th className="font-medium">After</th></tr></thead>
                <tbody>
                  {v.changes.map((c) => (
                    <tr key={c.field} className="align-top">
                      <td className="pr-2 text-ink-soft">{briefFieldLabels[c.field]}</td>
                      <td className="pr-2">{answerText(c.before)}</td>
                      <td>{answerText(c.after)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            ) : null}
          </details>
        </li>
      ))}
    </ol>
  );
}
