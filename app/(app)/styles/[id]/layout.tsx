import { constructionLabels, garmentTypeLabels } from '@/lib/validations/style';
import { StatusBadge } from '@/components/styles/status-badge';
import { SectionTabs } from '@/components/workspace/section-tabs';
import { workspaceStyle } from '@/components/workspace/workspace-style';

export default async function StyleWorkspaceLayout({ children, params }: { children: React.ReactNode; params: Promise<{ id: string }> }) {
  const { user, style } = await workspaceStyle((await params).id);
  return (
    <div>
      <div className="mb-4 border-b border-rule">
        <div className="mb-3 flex flex-wrap items-end justify-between gap-3">
          <div>
            <div className="mb-1 flex items-center gap-2 text-xs text-ink-faint">
              <a href="/styles" className="hover:text-ink">Styles</a>
              <span aria-hidden>/</span>
              <span className="figures">{style.code}</span>
            </div>
            <h1 className="flex items-center gap-3 text-[22px] font-semibold tracking-tight">
              {style.name}
              <StatusBadge status={style.status} />
            </h1>
            <div className="mt-1 text-sm text-ink-soft">
              <span className="figures">{style.code}</span> · {style.season || 'no season'} · {garmentTypeLabels[style.garmentType]} ·{' '}
              {constructionLabels[style.construction]} · {style.clientName ?? 'no client'} · <span className="figures">Rev. {style.revision}</span>
            </div>
          </div>
        </div>
        <SectionTabs styleId={style.id} role={user.role} />
      </div>
      {children}
    </div>
  );
}
