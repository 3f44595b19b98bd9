import { renderEmail, type RenderedEmail } from './layout';

/** The season report, sent to the landowner with the PDF attached and a link to the results in the portal. */
export function seasonReportSentEmail(input: { firmName: string; firmContact?: string[]; consultantName: string; propertyName: string; seasonLabel: string; url: string }): RenderedEmail {
  return renderEmail({
    subject: `Season report ${input.seasonLabel} for ${input.propertyName} from ${input.firmName}`,
    firmName: input.firmName,
    firmContact: input.firmContact,
    greeting: 'Hello,',
    paragraphs: [
      `${input.consultantName} has put together the ${input.seasonLabel} season report for ${input.propertyName}: the work done, the camera-survey estimates, the harvest and what we recommend for next season. The PDF is attached.`,
      'The same report, and the survey and harvest charts, are in your portal whenever you want them.',
    ],
    action: { label: 'See the results', url: input.url },
  });
}
