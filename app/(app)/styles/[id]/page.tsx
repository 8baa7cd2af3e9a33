import type { Metadata } from 'next';
import { can } from '@/lib/auth/roles';
import { Card } from '@/components/ui/card';
import { StyleForm } from '@/components/styles/style-form';
import { SharesPanel } from '@/components/styles/shares-panel';
import { BriefSection } from '@/components/brief/brief-section';
import { workingCopyStyle } from '@/components/workspace/workspace-style';

export const metadata: Metadata = { title: 'Brief' };

export default async function StyleBriefPage({ params }: { params: Promise<{ id: string }> }) {
  const { user, style } = await workingCopyStyle((await params).id);
  const editable = can(user.role, 'style:edit');
  return (
    <>
      <div className="grid grid-cols-1 gap-5 xl:grid-cols-[1fr_340px]">
        <Card title="Style and machine">
          <StyleForm style={style} readOnly={!editable} />
        </Card>
        <SharesPanel style={style} canShare={can(user.role, 'style:share')} />
      </div>
      {can(user.role, 'brief:read') ? <BriefSection styleId={style.id} sizes={style.sizes.labels} editable={editable} /> : null}
    </>
  );
}
