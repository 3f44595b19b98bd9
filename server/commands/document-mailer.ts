/**
 * The 'document-email' job: renders a sent proposal's or invoice's PDF and queues its e-mail (PDF
 * attached) to each recipient. The send action hands this over in its own transaction; the e-mails
 * are written once, whatever the number of tries or instances.
 */
import { Firm, Invoice, Property, Proposal } from '../models';
import { notFound } from '../errors';
import { enqueueEmail } from '../services/mail/outbox';
import { renderProposalPdfFor } from '../services/proposals/proposal-pdf';
import { renderInvoicePdfFor } from '../services/invoices/invoice-pdf';
import { proposalSentEmail } from '../../templates/email/proposal-sent';
import { invoiceSentEmail } from '../../templates/email/invoice';
import { config } from '../config';
import { emailFirmContact } from '../services/firm-profile';
import type { JobContext } from '../services/jobs/job-queue';
import type { RenderedEmail } from '../../templates/email/layout';

export interface DocumentEmailData {
  document: 'proposal' | 'invoice';
  id: number;
  firmId: number;
  recipients: string[];
  consultantName: string;
}

/** A rendered document and the one e-mail each recipient gets with it. */
interface PreparedDocument {
  kind: 'proposal-sent' | 'invoice-sent';
  pdf: Buffer;
  filename: string;
  email: RenderedEmail;
}

/** Reads the document, draws its PDF and writes its e-mail (404 when it is not the firm's). */
async function prepareDocument(data: DocumentEmailData, job: JobContext): Promise<PreparedDocument> {
  if (data.document === 'proposal') {
    const proposal = await Proposal.findOne({ where: { id: data.id, firmId: data.firmId } });
    if (!proposal) throw notFound('That proposal');
    await job.progress(30, 'Drawing the PDF');
    const pdf = await renderProposalPdfFor(proposal);
    const [firm, property] = await Promise.all([Firm.findByPk(data.firmId), Property.findByPk(proposal.propertyId, { attributes: ['name'] })]);
    return {
      kind: 'proposal-sent',
      pdf,
      filename: `${proposal.number}-v${proposal.version}.pdf`,
      email: proposalSentEmail({ firmName: firm?.name ?? '', firmContact: emailFirmContact(firm), consultantName: data.consultantName, propertyName: property?.name ?? '', number: proposal.number, version: proposal.version, totalCents: proposal.totalCents, expiresOn: proposal.expiresOn, url: `${config.publicUrl}/portal/proposals/${proposal.id}` }),
    };
  }
  const invoice = await Invoice.findOne({ where: { id: data.id, firmId: data.firmId } });
  if (!invoice) throw notFound('That invoice');
  await job.progress(30, 'Drawing the PDF');
  const pdf = await renderInvoicePdfFor(invoice);
  const [firm, property] = await Promise.all([Firm.findByPk(invoice.firmId), invoice.propertyId ? Property.findByPk(invoice.propertyId, { attributes: ['name'] }) : null]);
  return {
    kind: 'invoice-sent',
    pdf,
    filename: `${invoice.number}.pdf`,
    email: invoiceSentEmail({ firmName: firm?.name ?? '', firmContact: emailFirmContact(firm), propertyName: property?.name ?? 'your property', number: invoice.number, kind: invoice.kind, totalCents: invoice.totalCents, balanceCents: Math.max(0, invoice.totalCents - invoice.amountPaidCents), dueOn: invoice.dueOn, url: `${config.publicUrl}/portal/invoices/${invoice.id}` }),
  };
}

/** Renders the document and queues its e-mails; the job's finish makes the e-mails exactly-once. */
export async function sendDocumentEmail(data: DocumentEmailData, job: JobContext): Promise<void> {
  await job.progress(10, 'Reading the document');
  const { kind, pdf, filename, email } = await prepareDocument(data, job);
  await job.progress(90, 'Queuing the e-mail');
  const attachment = { filename, contentType: 'application/pdf', contentBase64: pdf.toString('base64') };
  await job.finish(
    async (transaction) => {
      for (const to of data.recipients) await enqueueEmail({ firmId: data.firmId, kind, to, email, attachments: [attachment] }, transaction);
    },
    () => ({ emails: data.recipients.length, pdfBytes: pdf.length }),
  );
}
