import { renderEmail, type RenderedEmail } from './layout';
import { formatCents } from '../../shared/domain/money';
import { formatDate, formatMoment } from '../../shared/domain/clock';

/** The proposal, sent to the landowner with the PDF attached and a link to approve it online. */
export function proposalSentEmail(input: { firmName: string; firmContact?: string[]; consultantName: string; propertyName: string; number: string; version: number; totalCents: number; expiresOn: string | null; url: string }): RenderedEmail {
  return renderEmail({
    subject: `Proposal ${input.number} for ${input.propertyName} from ${input.firmName}`,
    firmName: input.firmName,
    firmContact: input.firmContact,
    greeting: 'Hello,',
    paragraphs: [
      `${input.consultantName} has prepared the habitat plan proposal ${input.number}${input.version > 1 ? ` (version ${input.version})` : ''} for ${input.propertyName}. The total is ${formatCents(input.totalCents)}; the PDF is attached.`,
      `Open it in your portal to see the plan on the map, choose any options, and approve it by typing your name${input.expiresOn ? ` before the end of ${formatDate(input.expiresOn)}` : ''} — or tell us what you would like changed.`,
    ],
    action: { label: 'Review the proposal', url: input.url },
  });
}

/** Tells the consultant the landowner approved or declined. */
export function proposalDecidedEmail(input: { firmName: string; firmContact?: string[]; clientName: string; propertyName: string; number: string; version: number; decision: 'approved' | 'declined'; signedName?: string; reason?: string; totalCents: number; url: string; decidedAt?: Date; timeZone?: string }): RenderedEmail {
  const approved = input.decision === 'approved';
  return renderEmail({
    subject: `${input.clientName} ${input.decision} proposal ${input.number}`,
    firmName: input.firmName,
    firmContact: input.firmContact,
    greeting: 'Hello,',
    paragraphs: approved
      ? [`${input.signedName} approved proposal ${input.number} (version ${input.version}) for ${input.propertyName}, for a total of ${formatCents(input.totalCents)}${input.decidedAt && input.timeZone ? `, on ${formatMoment(input.decidedAt, input.timeZone)}` : ''}.`, 'The approved version is now fixed; the work can be scheduled and the deposit invoiced.']
      : [`${input.clientName} declined proposal ${input.number} (version ${input.version}) for ${input.propertyName}.`, `Their reason: “${input.reason ?? ''}”`],
    action: { label: 'Open the proposal', url: input.url },
  });
}
