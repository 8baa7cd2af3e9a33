import { db, type Db } from './knex';
import { HttpError } from '@/lib/api/errors';
import { isOutsideRole, type Role } from '@/lib/auth/roles';

export interface Organisation {
  id: string;
  kind: 'mill' | 'client';
  name: string;
  contactEmails: string[];
}

interface OrgRow { id: string; kind: 'mill' | 'client'; name: string; contact_emails: string[] }

const toOrg = (r: OrgRow): Organisation => ({ id: r.id, kind: r.kind, name: r.name, contactEmails: r.contact_emails });

export async function listOrganisations(studioId: string, q: Db = db()): Promise<Organisation[]> {
  const rows = (await q('organisations').where({ studio_id: studioId }).orderBy(['kind', 'name'])) as OrgRow[];
  return rows.map(toOrg);
}

export async function findOrganisation(studioId: string, id: string, q: Db = db()): Promise<Organisation | null> {
  const row = (await q('organisations').where({ studio_id: studioId, id }).first()) as OrgRow | undefined;
  return row ? toOrg(row) : null;
}

/**
 * The organisation a member with `role` belongs to: a mill account to one of the studio's mills, a
 * client account to one of its clients (400 with a field error otherwise); studio staff to none.
 */
export async function organisationForRole(studioId: string, role: Role, organisationId: string | null | undefined, q: Db = db()): Promise<string | null> {
  if (!isOutsideRole(role)) return null;
  const refuse = (message: string) => new HttpError(400, 'Some fields need attention.', { fieldErrors: { organisationId: [message] } });
  if (!organisationId) throw refuse('Mill and client accounts belong to an organisation');
  const org = await findOrganisation(studioId, organisationId, q);
  if (!org) throw refuse('Unknown organisation');
  if (org.kind !== role) throw refuse(role === 'mill' ? 'A mill account belongs to a mill' : 'A client account belongs to a client');
  return org.id;
}
