import { currentUser } from '@/lib/auth/authorize';
import { briefChecks } from '@/lib/db/brief-checks';
import { listReferences, loadBrief } from '@/lib/db/briefs';
import { BriefWorkspace } from './brief-workspace';

/** The questionnaire, the reference board and Brief vs plan, read on the server for the first paint. */
export async function BriefSection({ styleId, sizes, editable }: { styleId: string; sizes: string[]; editable: boolean }) {
  const user = await currentUser();
  if (!user) return null;
  const [brief, references, checks] = await Promise.all([loadBrief(user, styleId), listReferences(user, styleId), briefChecks(user, styleId)]);
  return <BriefWorkspace styleId={styleId} sizes={sizes} editable={editable} initial={{ brief, references, checks }} />;
}
