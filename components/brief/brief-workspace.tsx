'use client';

import { Card, Notice } from '@/components/ui/card';
import { BriefForm } from './brief-form';
import { ReferenceBoard } from './reference-board';
import { BriefChecksPanel } from './brief-checks-panel';
import { BriefVersions } from './brief-versions';
import type { Brief, BriefReference, BriefVersion } from '@/lib/db/briefs';
import type { BriefCheck } from '@/lib/rules/brief';
import { useBrief, useBriefChecks, useReferences } from './use-brief';

/** The questionnaire, the reference board and the Brief vs plan panel, below the style form. */
export function BriefWorkspace({ styleId, sizes, editable, initial }: {
  styleId: string; sizes: string[]; editable: boolean;
  initial: { brief: Brief; references: BriefReference[]; checks: { checks: BriefCheck[]; saved: boolean }; versions: BriefVersion[] | null };
}) {
  const brief = useBrief(styleId, initial.brief);
  const refs = useReferences(styleId, initial.references);
  const checks = useBriefChecks(styleId, initial.checks);
  return (
    <div className="mt-5 grid grid-cols-1 gap-5 xl:grid-cols-[1fr_340px]" data-testid="brief-section">
      <div className="space-y-5">
        <Card title="Client brief">
          {brief.data ? (
            <BriefForm styleId={styleId} brief={brief.data} sizes={sizes} readOnly={!editable} />
          ) : brief.error ? <Notice tone="error">{brief.error.message}</Notice> : <p className="text-sm text-ink-faint">Loading the brief…</p>}
        </Card>
        <Card title="Reference board">
          {refs.data ? <ReferenceBoard styleId={styleId} references={refs.data} readOnly={!editable} /> : refs.error ? <Notice tone="error">{refs.error.message}</Notice> : <p className="text-sm text-ink-faint">Loading…</p>}
        </Card>
      </div>
      <div className="space-y-5">
        <Card title="Brief vs plan">
          {checks.data ? (
            <>
              {checks.data.saved ? null : <p className="mb-2 text-xs text-ink-faint">No brief saved yet: fill in the questionnaire to check the plan against it.</p>}
              <BriefChecksPanel checks={checks.data.checks} />
            </>
          ) : checks.error ? <Notice tone="error">{checks.error.message}</Notice> : <p className="text-sm text-ink-faint">Checking…</p>}
        </Card>
        {initial.versions ? (
          <Card title="Earlier versions">
            <BriefVersions styleId={styleId} initial={initial.versions} />
          </Card>
        ) : null}
      </div>
    </div>
  );
}
