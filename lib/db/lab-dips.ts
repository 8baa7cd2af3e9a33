import type { Knex } from 'knex';
import { db, type Db } from './knex';
import type { SessionUser } from './users';
import { isOutsideRole } from '@/lib/auth/roles';
import { findStyle } from './styles';
import { colourStandardsByIds } from './colour-standards';
import { studioColourSettings } from './colourways';
import { conflict, HttpError, notFound } from '@/lib/api/errors';
import type { LabDipTolerance } from '@/lib/colour/difference';
import { sameLab, type Lab } from '@/lib/colour/lab';
import { meanLab, readLabDip, type LabDipReading } from '@/lib/colour/lab-dip';
import type { LabDipDecisionInput, LabDipInput } from '@/lib/validations/colour';

export type LabDipStatus = 'submitted' | 'approved' | 'rejected';

/** A lab dip with its difference from the target it was submitted against. */
export interface LabDip {
  id: string;
  styleId: string;
  colourwayId: string;
  colourwayName: string;
  targetId: string;
  targetName: string;
  /** 1 for the first dip sent for the target. */
  sequence: number;
  organisationName: string | null;
  submittedByName: string | null;
  submittedAt: string;
  /** Readings as entered; `measured` is their mean. */
  readings: Lab[];
  measured: Lab;
  /** The target colour and tolerance at submission. */
  targetLab: Lab;
  tolerance: LabDipTolerance;
  comment: string;
  status: LabDipStatus;
  decidedByName: string | null;
  decidedAt: string | null;
  decisionComment: string;
  /** A photo of the dip (download through /api/files/[id]); null when none, and for client reviewers. */
  photoFileId: string | null;
  version: number;
  /** ΔE CMC(2:1), ΔE00, ΔL/ΔC/ΔH and their words, against `targetLab`. */
  reading: LabDipReading;
}

interface LabDipRow {
  id: string; style_id: string; colourway_id: string; colourway_name: string; target_id: string; target_name: string;
  sequence: number; organisation_name: string | null; submitted_by_name: string | null; submitted_at: Date;
  readings: Lab[]; lab_l: number; lab_a: number; lab_b: number; target_lab: Lab; tolerance: LabDipTolerance; comment: string;
  status: LabDipStatus; decided_by_name: string | null; decided_at: Date | null; decision_comment: string; version: number;
  photo_file_id: string | null;
  /** The target's colour now; read for client reviewers only. */
  now_l?: number | null; now_a?: number | null; now_b?: number | null;
}

function toLabDip(r: LabDipRow, user: SessionUser): LabDip {
  const measured = { L: r.lab_l, a: r.lab_a, b: r.lab_b };
  return {
    id: r.id,
    styleId: r.style_id,
    colourwayId: r.colourway_id,
    colourwayName: r.colourway_name,
    targetId: r.target_id,
    targetName: r.target_name,
    sequence: r.sequence,
    organisationName: r.organisation_name,
    submittedByName: r.submitted_by_name,
    submittedAt: r.submitted_at.toISOString(),
    readings: r.readings,
    measured,
    targetLab: r.target_lab,
    tolerance: r.tolerance,
    comment: r.comment,
    status: r.status,
    decidedByName: r.decided_by_name,
    decidedAt: r.decided_at ? r.decided_at.toISOString() : null,
    decisionComment: r.decision_comment,
    photoFileId: user.role === 'client' ? null : r.photo_file_id,
    version: r.version,
    reading: readLabDip(r.target_lab, measured, r.tolerance),
  };
}

/**
 * The lab dips of a style the user may see: studio staff all; a mill the dips its own organisation
 * sent; a client reviewer the approved ones. Newest first.
 */
function visibleDips(user: SessionUser, styleId: string, q: Db) {
  const qb = q('lab_dips as d')
    .join('colourways as cw', 'cw.id', 'd.colourway_id')
    .join('colourway_targets as t', 't.id', 'd.target_id')
    .leftJoin('organisations as o', 'o.id', 'd.organisation_id')
    .leftJoin('users as su', 'su.id', 'd.submitted_by')
    .leftJoin('users as du', 'du.id', 'd.decided_by')
    .where('d.style_id', styleId)
    .whereNull('cw.archived_at')
    .select(
      'd.*', 'cw.name as colourway_name', 't.name as target_name', 'o.name as organisation_name',
      'su.name as submitted_by_name', 'du.name as decided_by_name',
    );
  if (user.role === 'mill') qb.andWhere('d.organisation_id', user.organisationId ?? '00000000-0000-0000-0000-000000000000');
  if (user.role === 'client') {
    // The target's colour now (its standard's, else its own), to withhold approvals of a colour
    // that has since been edited, as the colourways withhold the target.
    qb.andWhere('d.status', 'approved')
      .leftJoin('colour_standards as cs', 'cs.id', 't.standard_id')
      .select(
        q.raw('coalesce(cs.lab_l, t.lab_l) as now_l'),
        q.raw('coalesce(cs.lab_a, t.lab_a) as now_a'),
        q.raw('coalesce(cs.lab_b, t.lab_b) as now_b'),
      );
  }
  return qb;
}

/** For a client reviewer, only the dips judged against the colour their target has now. */
function stillApproved(rows: readonly LabDipRow[], user: SessionUser): LabDipRow[] {
  if (user.role !== 'client') return [...rows];
  return rows.filter((r) => r.now_l !== undefined && sameLab(r.target_lab, { L: r.now_l ?? 0, a: r.now_a ?? 0, b: r.now_b ?? 0 }));
}

export async function listLabDips(user: SessionUser, styleId: string, filter: { colourwayId?: string } = {}, q: Db = db()): Promise<LabDip[]> {
  const style = await findStyle(user, styleId, q);
  if (!style) throw notFound('Style not found.');
  const qb = visibleDips(user, styleId, q);
  if (filter.colourwayId) qb.andWhere('d.colourway_id', filter.colourwayId);
  const rows = (await qb.orderBy([{ column: 'd.submitted_at', order: 'desc' }, { column: 'd.sequence', order: 'desc' }])) as LabDipRow[];
  return stillApproved(rows, user).map((r) => toLabDip(r, user));
}

export async function findLabDip(user: SessionUser, styleId: string, labDipId: string, q: Db = db()): Promise<LabDip> {
  const style = await findStyle(user, styleId, q);
  if (!style) throw notFound('Style not found.');
  const [row] = stillApproved([(await visibleDips(user, styleId, q).andWhere('d.id', labDipId).first()) as LabDipRow].filter(Boolean), user);
  if (!row) throw notFound('Lab dip not found.');
  return toLabDip(row, user);
}

/**
 * Records a lab dip for a target of one of the style's colourways: the mean of its readings, the
 * target colour and tolerance as they are now (from the target's standard, or the studio's
 * tolerance for entered colours), numbered after the target's earlier dips. Written to the style's
 * history. Mills submit only for styles shared with them (the style must be visible).
 */
export async function submitLabDip(user: SessionUser, styleId: string, input: LabDipInput, q: Knex = db()): Promise<LabDip> {
  const id = await q.transaction(async (trx) => {
    const style = await findStyle(user, styleId, trx);
    if (!style) throw notFound('Style not found.');
    const target = (await trx('colourway_targets as t')
      .join('colourways as cw', 'cw.id', 't.colourway_id')
      .where({ 't.id': input.targetId, 'cw.style_id': styleId })
      .whereNull('t.archived_at')
      .whereNull('cw.archived_at')
      .forUpdate('t')
      .first('t.*', 'cw.name as colourway_name')) as
      | { id: string; colourway_id: string; colourway_name: string; name: string; standard_id: string | null; lab_l: number | null; lab_a: number | null; lab_b: number | null }
      | undefined;
    if (!target) throw new HttpError(400, 'Some fields need attention.', { fieldErrors: { targetId: ['Not a target of this style’s colourways'] } });
    let targetLab: Lab;
    let tolerance: LabDipTolerance;
    if (target.standard_id) {
      const standard = (await colourStandardsByIds(user.studioId, [target.standard_id], trx)).get(target.standard_id);
      if (!standard) throw notFound('Colour standard not found.');
      targetLab = standard.lab;
      tolerance = standard.tolerance;
    } else {
      targetLab = { L: target.lab_l ?? 0, a: target.lab_a ?? 0, b: target.lab_b ?? 0 };
      tolerance = (await studioColourSettings(user.studioId, trx)).tolerance;
    }
    if (input.photoFileId) {
      const photo = await trx('files')
        .where({ id: input.photoFileId, studio_id: user.studioId, style_id: styleId, kind: 'photo' })
        .modify((qb) => {
          if (isOutsideRole(user.role)) qb.andWhere('organisation_id', user.organisationId ?? '');
        })
        .first('id');
      if (!photo) throw new HttpError(400, 'Some fields need attention.', { fieldErrors: { photoFileId: ['Not a photo uploaded to this style'] } });
    }
    const measured = meanLab(input.readings);
    const last = (await trx('lab_dips').where({ target_id: target.id }).max('sequence as max').first()) as { max: number | null } | undefined;
    const sequence = (last?.max ?? 0) + 1;
    const [row] = (await trx('lab_dips')
      .insert({
        style_id: styleId,
        colourway_id: target.colourway_id,
        target_id: target.id,
        sequence,
        organisation_id: user.role === 'mill' ? user.organisationId : null,
        submitted_by: user.id,
        readings: JSON.stringify(input.readings),
        lab_l: measured.L,
        lab_a: measured.a,
        lab_b: measured.b,
        target_lab: JSON.stringify(targetLab),
        tolerance: JSON.stringify(tolerance),
        comment: input.comment,
        photo_file_id: input.photoFileId,
      })
      .returning('id')) as [{ id: string }];
    const reading = readLabDip(targetLab, measured, tolerance);
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'lab-dip.submit',
      details: JSON.stringify({
        labDipId: row.id, colourway: target.colourway_name, target: target.name, sequence,
        readings: input.readings.length, deltaE: Number(reading.deltaE.toFixed(2)), pass: reading.pass, photo: input.photoFileId !== null,
      }),
    });
    return row.id;
  });
  return findLabDip(user, styleId, id, q);
}

/**
 * Approves or rejects a submitted lab dip when `input.version` is its version. A stale version, or
 * a dip already decided, gets 409 and nothing changes. Written to the style's history.
 */
export async function decideLabDip(
  user: SessionUser,
  styleId: string,
  labDipId: string,
  input: LabDipDecisionInput,
  q: Knex = db(),
): Promise<LabDip> {
  await q.transaction(async (trx) => {
    const current = await findLabDip(user, styleId, labDipId, trx);
    if (current.status !== 'submitted') {
      throw conflict(`This lab dip was already ${current.status}${current.decidedByName ? ` by ${current.decidedByName}` : ''}.`, {
        currentVersion: current.version,
      });
    }
    const n = await trx('lab_dips')
      .where({ id: labDipId, style_id: styleId, version: input.version, status: 'submitted' })
      .update({
        status: input.decision,
        decided_by: user.id,
        decided_at: trx.fn.now(),
        decision_comment: input.comment,
        version: trx.raw('version + 1'),
      });
    if (n === 0) {
      throw conflict('Someone changed this lab dip after you opened it. Reload to see it.', { currentVersion: current.version });
    }
    await trx('audit_log').insert({
      studio_id: user.studioId, style_id: styleId, user_id: user.id, action: 'lab-dip.decide',
      details: JSON.stringify({
        labDipId, decision: input.decision, colourway: current.colourwayName, target: current.targetName,
        sequence: current.sequence, comment: input.comment,
      }),
    });
  });
  return findLabDip(user, styleId, labDipId, q);
}
