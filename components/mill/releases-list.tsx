import type { ReleaseSummary } from '@/lib/db/releases';
import { Card } from '@/components/ui/card';

const reviewWords = { pending: 'review asked', approved: 'approved', 'changes-requested': 'changes asked' } as const;

/** The releases of a style, newest first, each linking to the revision as it was released. */
export function ReleasesList({ releases }: { releases: ReleaseSummary[] }) {
  return (
    <Card title="Released revisions">
      {releases.length === 0 ? (
        <p className="text-sm text-ink-soft">Nothing released yet.</p>
      ) : (
        <ul className="divide-y divide-rule text-sm">
          {releases.map((r) => (
            <li key={r.id} className="flex flex-wrap items-baseline gap-x-4 gap-y-1 py-2">
              <a href={`/releases/${r.id}`} className="figures font-semibold text-spruce-700 hover:underline">Revision {r.revision}</a>
              <time className="figures text-ink-faint" dateTime={r.releasedAt}>{r.releasedAt.slice(0, 16).replace('T', ' ')}</time>
              <span className="text-ink-soft">{r.releasedBy ?? '—'} → {r.mills.map((m) => m.name).join(', ') || '—'}</span>
              {r.reviews.map((v) => (
                <span key={v.organisationId} className="rounded-full bg-rule/60 px-2 py-0.5 text-xs text-ink-soft">{v.organisationName}: {reviewWords[v.status]}</span>
              ))}
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
