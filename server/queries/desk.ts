/** The consultant's Desk read: the firm at a glance and what needs attention this week (several queries, one answer). */
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { Firm } from '../models';
import type { DeskSummary } from '../../shared/schemas/desk';
import { Practice, Prescription, Property, Task, Unit } from '../models';
import { practiceWindow, REGIONS, type Region } from '../../shared/domain/planting-windows';
import { todayInZone } from '../services/clock';
import { Op } from 'sequelize';
import { firstSteps } from '../../shared/domain/first-steps';
import { hasHomeArea } from '../services/firm-profile';

/** The Desk summary of a firm; "today" is the calendar date in the firm's time zone. */
export async function readDesk(firmId: number, firmTimezone: string | null | undefined): Promise<DeskSummary> {
  // Today in the firm's time zone, not the database's or the server's.
  const today = todayInZone(firmTimezone);
  const q = <T extends object>(sql: string) => sequelize.query<T>(sql, { replacements: { firmId, today }, type: QueryTypes.SELECT });
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
  const year = Number(today.slice(0, 4));
  const region: Region = (REGIONS as readonly string[]).includes(firm?.region ?? '') ? (firm!.region as Region) : 'midwest';
  const [waiting, prescriptions, practices] = await Promise.all([
    q<{ id: number; number: string; version: number; property_name: string; client_name: string; total_cents: number; sent_at: Date | null; first_viewed_at: Date | null; expires_on: string | null }>(`
      SELECT p.id, p.number, p.version, pr.name AS property_name, c.name AS client_name, p.total_cents, p.sent_at, p.first_viewed_at, p.expires_on::text
      FROM proposals p JOIN properties pr ON pr.id = p.property_id JOIN clients c ON c.id = p.client_id
      WHERE p.firm_id = :firmId AND p.status = 'sent' AND (p.expires_on IS NULL OR p.expires_on >= CAST(:today AS date))
      ORDER BY p.sent_at ASC LIMIT 12`),
    Prescription.findAll({ where: { firmId, year: { [Op.gte]: year - 1 } }, attributes: ['id', 'propertyId', 'unitId', 'practiceId', 'schedule'] }),
    Practice.findAll({ where: { firmId, archived: false }, attributes: ['id', 'name', 'definition'] }),
  ]);
  const [depositDrafts, moneyIn] = await Promise.all([
    q<{ id: number; number: string; client_name: string; property_name: string | null; proposal_id: number | null; proposal_number: string | null; total_cents: number; decided_at: Date | null }>(`
      SELECT i.id, i.number, c.name AS client_name, pr.name AS property_name, i.proposal_id, p.number AS proposal_number, i.total_cents, p.decided_at
      FROM invoices i JOIN clients c ON c.id = i.client_id LEFT JOIN properties pr ON pr.id = i.property_id LEFT JOIN proposals p ON p.id = i.proposal_id
      WHERE i.firm_id = :firmId AND i.status = 'draft' AND i.kind = 'deposit' ORDER BY i.created_at DESC, i.id DESC LIMIT 12`),
    q<{ id: number; invoice_id: number; number: string; client_name: string; amount_cents: number; received_at: Date; status: string }>(`
      SELECT pay.id, pay.invoice_id, i.number, c.name AS client_name, pay.amount_cents, pay.received_at, i.status
      FROM invoice_payments pay JOIN invoices i ON i.id = pay.invoice_id JOIN clients c ON c.id = i.client_id
      WHERE pay.firm_id = :firmId AND pay.received_at >= now() - interval '14 days' ORDER BY pay.received_at DESC, pay.id DESC LIMIT 12`),
  ]);
  const [unitRows, propertyRows, finishedTasks] = await Promise.all([
    Unit.findAll({ where: { id: [...new Set(prescriptions.map((p) => p.unitId))] }, attributes: ['id', 'name'] }),
    Property.findAll({ where: { id: [...new Set(prescriptions.map((p) => p.propertyId))] }, attributes: ['id', 'name'] }),
    Task.findAll({ where: { firmId, prescriptionId: prescriptions.map((p) => p.id), status: ['done', 'skipped'] }, attributes: ['prescriptionId', 'stepKey'] }),
  ]);
  // A step whose task is done or skipped needs no attention, whatever the prescription's own schedule says.
  const finished = new Set(finishedTasks.map((t) => `${t.prescriptionId}:${t.stepKey}`));
  const unitName = new Map(unitRows.map((u) => [u.id, u.name]));
  const propertyName = new Map(propertyRows.map((p) => [p.id, p.name]));
  const practiceName = new Map(practices.map((p) => [p.id, p.name]));
  const inWindow = prescriptions
    .flatMap((p) =>
      p.schedule.steps
        .filter((s) => !s.done && !finished.has(`${p.id}:${s.stepKey}`) && s.earliest <= today && today <= s.latest)
        .map((s) => ({ prescriptionId: p.id, propertyId: p.propertyId, propertyName: propertyName.get(p.propertyId) ?? '', unitName: unitName.get(p.unitId) ?? '', practiceName: practiceName.get(p.practiceId) ?? '', stepName: s.name, earliest: s.earliest, latest: s.latest })),
    )
    .sort((a, b) => a.latest.localeCompare(b.latest))
    .slice(0, 12);
  return {
    firm: { name: firm?.name ?? '', region: firm?.region ?? '' },
    counts: { clients: Number(c.clients), properties: Number(c.properties), totalAcres: Math.round(Number(c.acres ?? 0) * 10) / 10, pendingInvitations: Number(c.pending), crew: Number(c.crew) },
    recentProperties: recent.map((p) => ({ id: p.id, name: p.name, clientName: p.client_name, acres: p.acres === null ? null : Number(p.acres), county: p.county, state: p.state, updatedAt: new Date(p.updated_at).toISOString() })),
    waiting: waiting.map((w) => ({ id: w.id, number: w.number, version: w.version, propertyName: w.property_name, clientName: w.client_name, totalCents: w.total_cents, sentAt: w.sent_at ? new Date(w.sent_at).toISOString() : null, firstViewedAt: w.first_viewed_at ? new Date(w.first_viewed_at).toISOString() : null, expiresOn: w.expires_on })),
    inWindow,
    season: {
      year,
      region,
      windows: practices.map((p) => ({ practiceName: p.name, ...practiceWindow(p.definition, region, year) })).map(({ practiceName, earliest, latest }) => ({ practiceName, earliest, latest })),
    },
    activity: activity.map((a) => ({ id: a.id, action: a.action, actorName: a.actor_name, subjectType: a.subject_type, subjectId: a.subject_id, createdAt: new Date(a.created_at).toISOString() })),
    depositDrafts: depositDrafts.map((d) => ({ id: d.id, number: d.number, clientName: d.client_name, propertyName: d.property_name, proposalId: d.proposal_id, proposalNumber: d.proposal_number, totalCents: d.total_cents, approvedAt: d.decided_at ? new Date(d.decided_at).toISOString() : null })),
    moneyIn: moneyIn.map((m) => ({ id: m.id, invoiceId: m.invoice_id, number: m.number, clientName: m.client_name, amountCents: m.amount_cents, receivedAt: new Date(m.received_at).toISOString(), paidInFull: m.status === 'paid' })),
    firstSteps: firm ? firstSteps({ homeAreaSet: hasHomeArea(firm), address: firm.address, phone: firm.phone, email: firm.email, website: firm.website, logoKey: firm.logoKey, clients: Number(c.clients) }) : null,
  };
}
