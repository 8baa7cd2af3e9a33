import { db, type Db } from './knex';

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
