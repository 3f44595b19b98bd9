import { renderEmail, type RenderedEmail } from './layout';

/** Tells the owner the whole-firm zip is ready, with the page to download it from (sign-in needed). */
export function firmExportReadyEmail(input: { firmName: string; firmContact?: string[]; name: string; url: string; sizeText: string; fileCount: number }): RenderedEmail {
  return renderEmail({
    subject: `${input.firmName}: your data export is ready`,
    firmName: input.firmName,
    firmContact: input.firmContact,
    greeting: `Hello ${input.name},`,
    paragraphs: [
      `The export of ${input.firmName} you asked for is ready: one zip file of ${input.sizeText} holding ${input.fileCount} files — a CSV per table, a GeoJSON file per property, the proposal and invoice PDFs and every uploaded file.`,
      'Download it from the settings page while signed in as the firm’s owner. The link works only for your firm’s owner.',
    ],
    action: { label: 'Open the export page', url: input.url },
    footnote: 'The zip holds your clients’ names, addresses and e-mail addresses: keep it somewhere safe.',
  });
}
