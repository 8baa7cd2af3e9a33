import { notFound, redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { findStyle } from '@/lib/db/styles';
import { can } from '@/lib/auth/roles';
import { idParamSchema } from '@/lib/validations/style';
import { Card } from '@/components/ui/card';
import { StyleForm } from '@/components/styles/style-form';
import { SharesPanel } from '@/components/styles/shares-panel';

export default async function StyleBriefPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  const parsed = idParamSchema.safeParse(await params);
  if (!parsed.success) notFound();
  const style = await findStyle(user, parsed.data.id);
  if (!style) notFound();
  const editable = can(user.role, 'style:edit');
  return (
    <div className="grid grid-cols-1 gap-5 xl:grid-cols-[1fr_340px]">
      <Card title="Style and machine">
        <StyleForm style={style} readOnly={!editable} />
      </Card>
      <SharesPanel style={style} canShare={can(user.role, 'style:share')} />
    </div>
  );
}
