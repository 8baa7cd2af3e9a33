import type { Metadata } from 'next';
import { listStyleAudit } from '@/lib/db/audit';
import { isOutsideRole } from '@/lib/auth/roles';
import { Card } from '@/components/ui/card';
import { auditLines, describeAudit } from '@/components/workspace/describe-audit';
import { workspaceStyle } from '@/components/workspace/workspace-style';

export const metadata: Metadata = { title: 'History' };

export default async function StyleHistoryPage({ params }: { params: Promise<{ id: string }> }) {
  const { user, style } = await workspaceStyle((await params).id);
  if (isOutsideRole(user.role)) {
    return <Card title="History"><p className="text-sm text-ink-soft">The studio keeps the history of this style.</p></Card>;
  }
  const lines = auditLines(await listStyleAudit(user.studioId, style.id));
  const at = (iso: string) => iso.replace('T', ' ').slice(0, 16);
  return (
    <Card title="History">
      <ol className="divide-y divide-rule text-sm">
        {lines.map(({ latest: e, earliest, count }) => (
          <li key={e.id} className="flex gap-4 py-2">
            <time className="figures w-40 shrink-0 text-ink-faint" dateTime={e.createdAt}>
              {count > 1 ? `${at(earliest.createdAt)}–${at(e.createdAt).slice(earliest.createdAt.slice(0, 10) === e.createdAt.slice(0, 10) ? 11 : 0)}` : at(e.createdAt)}
            </time>
            <span className="w-40 shrink-0 font-medium">{e.userName ?? '—'}</span>
            <span className="text-ink-soft">
              {describeAudit(e.action, e.details)}
              {count > 1 ? <span className="text-ink-faint"> · {count} saves, the latest shown</span> : null}
            </span>
          </li>
        ))}
      </ol>
    </Card>
  );
}
