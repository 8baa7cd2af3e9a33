'use client';

import type { BriefCheck, BriefCheckStatus } from '@/lib/rules/brief';

const tone: Record<BriefCheckStatus, { label: string; cls: string }> = {
  ok: { label: 'On target', cls: 'bg-spruce-50 text-spruce-700 border-spruce-100' },
  warning: { label: 'Check', cls: 'bg-ochre-50 text-ochre-700 border-ochre-500/30' },
  error: { label: 'Off brief', cls: 'bg-madder-50 text-madder-700 border-madder-500/30' },
  missing: { label: 'Not computed yet', cls: 'bg-paper text-ink-soft border-rule' },
  info: { label: 'Note', cls: 'bg-paper text-ink-soft border-rule' },
};

export function BriefChecksPanel({ checks }: { checks: BriefCheck[] }) {
  return (
    <ul className="space-y-2" data-testid="brief-checks">
      {checks.map((c) => (
        <li key={c.id} className="rounded-md border border-rule p-2.5" data-check={c.id} data-status={c.status}>
          <div className="flex items-center justify-between gap-2">
            <span className="text-sm font-medium text-ink">{c.title}</span>
            <span className={`rounded border px-1.5 py-0.5 text-[11px] font-medium ${tone[c.status].cls}`}>{tone[c.status].label}</span>
          </div>
          <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-2 text-xs">
            <dt className="text-ink-faint">Brief</dt><dd className="text-ink-soft">{c.asked}</dd>
            <dt className="text-ink-faint">Plan</dt><dd className="text-ink-soft">{c.plan}</dd>
          </dl>
          <p className="mt-1 text-xs text-ink">{c.message}</p>
        </li>
      ))}
    </ul>
  );
}
