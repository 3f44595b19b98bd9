import { renderEmail, type RenderedEmail } from './layout';

/** The password reset link. */
export function passwordResetEmail(input: { firmName: string; firmContact?: string[]; name: string; url: string; ttlMinutes: number }): RenderedEmail {
  return renderEmail({
    subject: 'Reset your Browseline password',
    firmName: input.firmName,
    firmContact: input.firmContact,
    greeting: `Hello ${input.name},`,
    paragraphs: ['Someone (we hope you) asked to reset the password of your Browseline account.'],
    action: { label: 'Choose a new password', url: input.url },
    footnote: `This link works once and expires in ${input.ttlMinutes} minutes. If you did not ask for it, ignore this message: your password stays as it is.`,
  });
}
