import { currentUser } from '@/lib/auth/authorize';
import { briefChecks } from '@/lib/db/brief-checks';
import { canSeeCosts } from '@/lib/auth/roles';
import { listBriefVersions, listReferences, loadBrief } from '@/lib/db/briefs';
import { BriefWorkspace } from './brief-workspace';

/** The questionnaire, the reference board, Brief vs plan and (for staff) earlier versions, read on the server for the first paint. */
export async function BriefSection({ styleId, sizes, editable }: { styleId: string; sizes: string[]; editable: boolean }) {
  const user = await currentUser();
  if (!user) return null;
  const [brief, references, checks, versions] = await Promise.all([
    loadBrief(user, styleId), listReferences(user, styleId), briefChecks(user, styleId),
    // Earlier answers hold prices: studio staff only.
    canSeeCosts(user.role) ? listBriefVersions(user, styleId) : null,
  ]);
  return <BriefWorkspace styleId={styleId} sizes={sizes} editable={editable} initial={{ brief, references, checks, versions }} />;
}
