import type { Knex } from 'knex';
import { db } from './knex';
import type { SessionUser } from './users';
import { forbidden, notFound } from '@/lib/api/errors';
import { can, isOutsideRole } from '@/lib/auth/roles';
import { findStyle } from './styles';
import { briefAnswersForStudio } from './briefs';
import { loadStylePlan } from './plan-figures';
import { loadFitSheet } from './fit';
import { listColourways } from './colourways';
import { checkBriefAgainstPlan, type BriefCheck, type BriefTargets, type PlanFigures } from '@/lib/rules/brief';
import { emptyBrief, type BriefAnswers } from '@/lib/validations/brief';

export function briefTargets(a: BriefAnswers): BriefTargets {
  return {
    markets: a.markets,
    recycledMin: a.recycledPct === null ? null : a.recycledPct / 100,
    weight: a.weightTarget === null ? null : { unit: a.weightUnit, value: a.weightTarget },
    compression: a.compression,
    tones: a.tones,
    fibresToAvoid: a.fibresToAvoid,
  };
}

/**
 * The "Brief vs plan" checks of a style, after checking the user may read the brief; the checks
 * carry no prices. Yarns, fibres and fit are read with the studio's view of the plan; the colourways
 * with the user's own, so a client reviewer's tone counts hold only the colours the colour section
 * shows them (targets with an approved lab dip).
 */
export async function briefChecks(user: SessionUser, styleId: string, q: Knex = db()): Promise<{ checks: BriefCheck[]; saved: boolean }> {
  if (!can(user.role, 'brief:read')) throw forbidden();
  if (!(await findStyle(user, styleId, q))) throw notFound('Style not found.');
  const studioView: SessionUser = isOutsideRole(user.role) ? { ...user, role: 'colour-lead', organisationId: null, organisationName: null } : user;
  const answers = (await briefAnswersForStudio(user.studioId, styleId, q))?.answers ?? null;
  const plan = await loadStylePlan(studioView, styleId, 0.05, q);
  const { summary } = plan;
  const [sheet, colour] = await Promise.all([
    loadFitSheet(studioView, styleId, q).catch(() => null),
    listColourways(user, styleId, q).catch(() => null),
  ]);
  const kept = summary.consumption?.yarns ?? {};
  const figures: PlanFigures = {
    yarns: plan.yarns.map((y) => ({ id: y.id, name: y.name, fibres: y.fibres, recycledShare: y.recycledShare, keptGrams: kept[y.id]?.keptGrams ?? 0 })),
    labels: summary.labels ? { eu: summary.labels.eu.text, us: summary.labels.us.text } : null,
    garmentGrams: summary.consumption ? summary.consumption.keptGrams : null,
    garmentAreaM2: summary.textures.length ? summary.textures.reduce((a, t) => a + t.insideCm2, 0) / 10_000 : null,
    compression: sheet?.compression
      ? sheet.compression.flatMap((s) => s.girths.map((g) => ({ size: s.size, girth: g.girth, pressureMmHg: g.estimate.pressureMmHg, slack: g.estimate.slack })))
      : null,
    colourways: (colour?.colourways ?? []).map((c) => ({ name: c.name, tones: c.targets.length })),
  };
  return { checks: checkBriefAgainstPlan(briefTargets(answers ?? emptyBrief), figures), saved: answers !== null };
}
