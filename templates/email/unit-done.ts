import { formatDate } from '../../shared/domain/clock';
import { renderEmail, type RenderedEmail } from './layout';

/** Tells the landowner the planned work on one unit is finished, with a link to the progress page. */
export function unitDoneEmail(input: { firmName: string; firmContact?: string[]; propertyName: string; unitName: string; taskNames: string[]; doneOn: string; url: string }): RenderedEmail {
  return renderEmail({
    subject: `Work finished on ${input.unitName} at ${input.propertyName}`,
    firmName: input.firmName,
    firmContact: input.firmContact,
    greeting: 'Hello,',
    paragraphs: [
      `The crew finished the planned work on ${input.unitName} at ${input.propertyName} on ${formatDate(input.doneOn)}: ${input.taskNames.join('; ')}.`,
      'The crew’s notes and photos are on the progress page of your portal.',
    ],
    action: { label: 'See the progress', url: input.url },
  });
}
