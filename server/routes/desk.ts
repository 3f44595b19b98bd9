/** The consultant's Desk: what needs attention this week. */
import { QueryTypes } from 'sequelize';
import { defineRoutes, STAFF } from '../middlewares/access';
import { sequelize } from '../db/sequelize';
import { Firm } from '../models';
import { actor } from '../policies/firm-scope';
import type { DeskSummary } from '../../shared/schemas/desk';

const r = defineRoutes('/desk');

r.get('/', STAFF, async (req, res) => {
  const { firmId } = actor(req);
  const q = <T extends object>(sql: string) => sequelize.query<T>(sql, { replacements: { firmId }, type: QueryTypes.SELECT });
  const [firm, counts, recent, activity] = await Promise.all([
    Firm.findByPk(firmId),
    q<{ clients: string; properties: string; acres: string | null; pending: string; crew: string }>(`
      SELECT (SELECT count(*) FROM clients WHERE firm_id = :firmId) AS clients,
             (SELECT count(*) FROM properties WHERE firm_id = :firmId) AS properties,
             (SELECT sum(acres) FROM properties WHERE firm_id = :firmId) AS acres,
             (SELECT count(*) FROM users WHERE firm_id = :firmId AND password_hash IS NULL AND active) AS pending,
             (SELECT count(*) FROM users WHERE firm_id = :firmId AND role = 'crew' AND active) AS crew`),
    q<{ id: number; name: string; client_name: string; acres: string | null; county: string | null; state: string | null; updated_at: Date }>(`
      SELECT p.id, p.name, c.name AS client_name, p.acres, p.county, p.state, p.updated_at
      FROM properties p JOIN clients c ON c.id = p.client_id WHERE p.firm_id = :firmId ORDER BY p.updated_at DESC LIMIT 6`),
    q<{ id: number; action: string; actor_name: string | null; subject_type: string | null; subject_id: number | null; created_at: Date }>(`
      SELECT a.id, a.action, u.name AS actor_name, a.subject_type, a.subject_id, a.created_at
      FROM audit_events a LEFT JOIN users u ON u.id = a.user_id
      WHERE a.firm_id = :firmId AND a.action <> 'user.signed-in' ORDER BY a.created_at DESC LIMIT 8`),
  ]);
  const c = counts[0];
  const body: DeskSummary = {
    firm: { name: firm?.name ?? '', region: firm?.region ?? '' },
    counts: { clients: Number(c.clients), properties: Number(c.properties), totalAcres: Math.round(Number(c.acres ?? 0) * 10) / 10, pendingInvitations: Number(c.pending), crew: Number(c.crew) },
    recentProperties: recent.map((p) => ({ id: p.id, name: p.name, clientName: p.client_name, acres: p.acres === null ? null : Number(p.acres), county: p.county, state: p.state, updatedAt: new Date(p.updated_at).toISOString() })),
    activity: activity.map((a) => ({ id: a.id, action: a.action, actorName: a.actor_name, subjectType: a.subject_type, subjectId: a.subject_id, createdAt: new Date(a.created_at).toISOString() })),
  };
  res.json({ data: body });
});

export const deskRouter = r.router;
