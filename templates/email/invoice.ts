import { renderEmail, type RenderedEmail } from './layout';
import { formatCents } from '../../shared/domain/money';
import { formatDate } from '../../shared/domain/clock';

interface InvoiceMailBase {
  firmName: string; firmContact?: string[];
  propertyName: string;
  number: string;
  url: string;
}

const KIND_WORDS = { deposit: 'the deposit', progress: 'work completed', final: 'the rest of the work' } as const;

/** The invoice, sent to the landowner with its PDF attached and a link to pay it in the portal. */
export function invoiceSentEmail(input: InvoiceMailBase & { kind: keyof typeof KIND_WORDS; totalCents: number; balanceCents: number; dueOn: string | null }): RenderedEmail {
  return renderEmail({
    subject: `Invoice ${input.number} for ${input.propertyName} from ${input.firmName}`,
    firmName: input.firmName,
    firmContact: input.firmContact,
    greeting: 'Hello,',
    paragraphs: [
      `Invoice ${input.number} bills ${KIND_WORDS[input.kind]} on ${input.propertyName}. The total is ${formatCents(input.totalCents)}${input.balanceCents !== input.totalCents ? `, of which ${formatCents(input.balanceCents)} is still to pay` : ''}${input.dueOn ? `, due ${formatDate(input.dueOn)}` : ''}. The PDF is attached.`,
      'You can pay it by card in your portal, all at once or in parts.',
    ],
    action: { label: 'View and pay the invoice', url: input.url },
  });
}

/** The receipt for a payment the payments service confirmed. */
export function paymentReceiptEmail(input: InvoiceMailBase & { amountCents: number; balanceCents: number; receivedOn: string }): RenderedEmail {
  return renderEmail({
    subject: `Receipt: ${formatCents(input.amountCents)} paid on invoice ${input.number}`,
    firmName: input.firmName,
    firmContact: input.firmContact,
    greeting: 'Thank you,',
    paragraphs: [
      `We received ${formatCents(input.amountCents)} on ${formatDate(input.receivedOn)} for invoice ${input.number} (${input.propertyName}).`,
      input.balanceCents > 0 ? `${formatCents(input.balanceCents)} is still to pay on this invoice.` : 'The invoice is now paid in full.',
    ],
    action: { label: 'See the invoice', url: input.url },
  });
}

/** Tells the firm's consultant (and owners) that a landowner paid: how much, on which invoice, what is left. */
export function paymentReceivedStaffEmail(input: { firmName: string; clientName: string; propertyName: string; number: string; amountCents: number; balanceCents: number; receivedOn: string; url: string }): RenderedEmail {
  return renderEmail({
    subject: `${input.clientName} paid ${formatCents(input.amountCents)} on invoice ${input.number}`,
    firmName: input.firmName,
    greeting: 'Hello,',
    paragraphs: [
      `${input.clientName} paid ${formatCents(input.amountCents)} on ${input.receivedOn} for invoice ${input.number} (${input.propertyName}).`,
      input.balanceCents > 0 ? `${formatCents(input.balanceCents)} is still to pay on it.` : 'The invoice is now paid in full.',
    ],
    action: { label: 'Open the invoice', url: input.url },
  });
}

/** A reminder for an invoice past its due date. */
export function overdueReminderEmail(input: InvoiceMailBase & { balanceCents: number; dueOn: string; daysOverdue: number }): RenderedEmail {
  return renderEmail({
    subject: `Reminder: invoice ${input.number} was due ${formatDate(input.dueOn)}`,
    firmName: input.firmName,
    firmContact: input.firmContact,
    greeting: 'Hello,',
    paragraphs: [
      `Invoice ${input.number} for ${input.propertyName} was due on ${formatDate(input.dueOn)} (${input.daysOverdue} ${input.daysOverdue === 1 ? 'day' : 'days'} ago); ${formatCents(input.balanceCents)} is still to pay.`,
      'If you have paid it in the last day or two, thank you, and please ignore this reminder. If something is wrong with the invoice, reply and tell us.',
    ],
    action: { label: 'Pay the invoice', url: input.url },
  });
}

/** Tells the landowner money was refunded. */
export function refundEmail(input: InvoiceMailBase & { amountCents: number }): RenderedEmail {
  return renderEmail({
    subject: `Refund of ${formatCents(input.amountCents)} on invoice ${input.number}`,
    firmName: input.firmName,
    firmContact: input.firmContact,
    greeting: 'Hello,',
    paragraphs: [`We refunded ${formatCents(input.amountCents)} of your payment on invoice ${input.number} (${input.propertyName}). It usually reaches your card within 5 to 10 business days.`],
    action: { label: 'See the invoice', url: input.url },
  });
}
