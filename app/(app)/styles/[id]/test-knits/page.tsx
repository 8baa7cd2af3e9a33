import type { Metadata } from 'next';
import { can } from '@/lib/auth/roles';
import { listReleases } from '@/lib/db/releases';
import { listTestKnits, testKnitThreshold } from '@/lib/db/test-knits';
import { Card } from '@/components/ui/card';
import { RequestTestKnits, TestKnitList } from '@/components/mill/test-knits';
import { workspaceStyle } from '@/components/workspace/workspace-style';

export const metadata: Metadata = { title: 'Test knits' };

export default async function TestKnitsPage({ params }: { params: Promise<{ id: string }> }) {
  const { user, style } = await workspaceStyle((await params).id);
  if (user.role === 'client') {
    return <Card title="Test knits"><p className="text-sm text-ink-soft">The studio and the mill handle the test knits.</p></Card>;
  }
  const [knits, releases, threshold] = await Promise.all([listTestKnits(user, style.id), listReleases(user, style.id), testKnitThreshold(user.studioId)]);
  const latest = releases[0];
  return (
    <div className="space-y-5">
      {can(user.role, 'style:release') ? (
        <Card title="Request test knits">
          {latest ? <RequestTestKnits releaseId={latest.id} revision={latest.revision} /> : <p className="text-sm text-ink-soft">Release a revision to a mill first (Mill pack).</p>}
        </Card>
      ) : null}
      <TestKnitList knits={knits} canSubmit={user.role === 'mill'} canDecide={can(user.role, 'style:release')} thresholdPct={threshold} />
    </div>
  );
}
