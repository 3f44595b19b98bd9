import { z } from 'zod';
import { FIRST_STEP_KEYS } from '../domain/first-steps';

export const DeskSummarySchema = z.object({
  firm: z.object({ name: z.string(), region: z.string() }),
  counts: z.object({ clients: z.number().int(), properties: z.number().int(), totalAcres: z.number(), pendingInvitations: z.number().int(), crew: z.number().int() }),
  recentProperties: z.array(z.object({ id: z.number().int(), name: z.string(), clientName: z.string(), acres: z.number().nullable(), county: z.string().nullable(), state: z.string().nullable(), updatedAt: z.string() })),
  /** Sent proposals waiting on the landowner, oldest first. */
  waiting: z.array(z.object({ id: z.number().int(), number: z.string(), version: z.number().int(), propertyName: z.string(), clientName: z.string(), totalCents: z.number().int(), sentAt: z.string().nullable(), firstViewedAt: z.string().nullable(), expiresOn: z.string().nullable() })),
  /** Prescription steps whose window is open today, by closing date. */
  inWindow: z.array(z.object({ prescriptionId: z.number().int(), propertyId: z.number().int(), propertyName: z.string(), unitName: z.string(), practiceName: z.string(), stepName: z.string(), earliest: z.string(), latest: z.string() })),
  /** The season strip: this year's windows of the firm's practices in its region. */
  season: z.object({ year: z.number().int(), region: z.string(), windows: z.array(z.object({ practiceName: z.string(), earliest: z.string(), latest: z.string() })) }),
  activity: z.array(z.object({ id: z.number().int(), action: z.string(), actorName: z.string().nullable(), subjectType: z.string().nullable(), subjectId: z.number().nullable(), createdAt: z.string() })),
  /** Deposit invoices drafted when a landowner approved, not sent yet, newest first. */
  depositDrafts: z.array(z.object({ id: z.number().int(), number: z.string(), clientName: z.string(), propertyName: z.string().nullable(), proposalId: z.number().int().nullable(), proposalNumber: z.string().nullable(), totalCents: z.number().int(), approvedAt: z.string().nullable() })),
  /** Payments received in the last fourteen days, newest first. */
  moneyIn: z.array(z.object({ id: z.number().int(), invoiceId: z.number().int(), number: z.string(), clientName: z.string(), amountCents: z.number().int(), receivedAt: z.string(), paidInFull: z.boolean() })),
  /** A new firm's first steps (home area, profile, first client), each ticked off by its data; null once all are done. */
  firstSteps: z.array(z.object({ key: z.enum(FIRST_STEP_KEYS), done: z.boolean() })).nullable(),
});
export type DeskSummary = z.infer<typeof DeskSummarySchema>;

export const PortalPropertySummarySchema = z.object({
  id: z.number().int(),
  name: z.string(),
  acres: z.number().nullable(),
  county: z.string().nullable(),
  state: z.string().nullable(),
  objectives: z.string().nullable(),
});
export const PortalHomeSchema = z.object({
  client: z.object({ id: z.number().int(), name: z.string() }),
  firm: z.object({ name: z.string(), email: z.string().nullable(), phone: z.string().nullable() }),
  properties: z.array(PortalPropertySummarySchema),
});
export type PortalHome = z.infer<typeof PortalHomeSchema>;

export const FieldHomeSchema = z.object({
  firm: z.object({ name: z.string(), phone: z.string().nullable() }),
  contacts: z.array(z.object({ name: z.string(), role: z.string(), email: z.string(), phone: z.string().nullable() })),
});
export type FieldHome = z.infer<typeof FieldHomeSchema>;
