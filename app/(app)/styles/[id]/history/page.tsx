import type { Metadata } from 'next';
import { listStyleAudit } from '@/lib/db/audit';
import { isOutsideRole } from '@/lib/auth/roles';
import { Card } from '@/components/ui/card';
import { describeAudit } from '@/components/workspace/describe-audit';
import { workspaceStyle } from '@/components/workspace/workspace-style';

export const metadata: Metadata = { title: 'History' };

export default async function StyleHistoryPage({ params }: { params: Promise<{ id: string }> }) {
  const { user, style } = await workspaceStyle((await params).id);
  if (isOutsideRole(user.role)) {
    return <Card title="History"><p className="text-sm text-ink-soft">The studio keeps the history of this style.</p></Card>;
  }
  const entries = await listStyleAudit(user.studioId, style.id);
  return (
    <Card title="History">
      <ol className="divide-y divide-rule text-sm">
        {entries.map((e) => (
          <li key={e.id} className="flex gap-4 py-2">
            <time className="figures w-40 shrink-0 text-ink-faint" dateTime={e.createdAt}>{e.createdAt.replace('T', ' ').slice(0, 16)}</time>
            <span className="w-40 shrink-0 font-medium">{e.userName ?? '—'}</span>
            <span className="text-ink-soft">{describeAudit(e.action, e.details)}</span>
          </li>
        ))}
      </ol>
    </Card>
  );
}
