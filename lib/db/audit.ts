import { db, type Db } from './knex';

export interface AuditEntry {
  id: string;
  styleId: string | null;
  userId: string | null;
  userName: string | null;
  action: string;
  details: Record<string, unknown>;
  createdAt: string;
}

export async function writeAudit(
  entry: { studioId: string; styleId?: string | null; userId: string | null; action: string; details?: Record<string, unknown> },
  q: Db = db(),
): Promise<void> {
  await q('audit_log').insert({
    studio_id: entry.studioId,
    style_id: entry.styleId ?? null,
    user_id: entry.userId,
    action: entry.action,
    details: JSON.stringify(entry.details ?? {}),
  });
}

export async function listStyleAudit(studioId: string, styleId: string, limit = 200, q: Db = db()): Promise<AuditEntry[]> {
  const rows = await q('audit_log as a')
    .leftJoin('users as u', 'u.id', 'a.user_id')
    .where({ 'a.studio_id': studioId, 'a.style_id': styleId })
    .orderBy('a.id', 'desc')
    .limit(limit)
    .select('a.id', 'a.style_id', 'a.user_id', 'u.name as user_name', 'a.action', 'a.details', 'a.created_at');
  return rows.map((r: { id: string; style_id: string | null; user_id: string | null; user_name: string | null; action: string; details: Record<string, unknown>; created_at: Date }) => ({
    id: String(r.id),
    styleId: r.style_id,
    userId: r.user_id,
    userName: r.user_name,
    action: r.action,
    details: r.details,
    createdAt: r.created_at.toISOString(),
  }));
}
