import { renderEmail, type RenderedEmail } from './layout';

const ROLE_WORDS: Record<string, string> = {
  consultant: 'plan and price habitat work',
  crew: 'see your field tasks and mark them done',
  client: 'see the plan for your land, its progress, proposals and invoices',
};

/**
 * The invitation e-mail. Staff and crew join the firm's workspace; a landowner (role `client`) is
 * not joining anyone's team: they are given a portal to their own land's plan.
 */
export function invitationEmail(input: { firmName: string; firmContact?: string[]; inviterName: string; name: string; role: string; url: string; ttlHours: number }): RenderedEmail {
  const client = input.role === 'client';
  return renderEmail({
    subject: client ? `${input.firmName} opened a portal for your land on Browseline` : `${input.inviterName} invited you to ${input.firmName} on Browseline`,
    firmName: input.firmName,
    firmContact: input.firmContact,
    greeting: `Hello ${input.name},`,
    paragraphs: client
      ? [
          `${input.inviterName} of ${input.firmName} has set up a portal for you on Browseline, where you can ${ROLE_WORDS.client}.`,
          'Choose a password to open it.',
        ]
      : [`${input.inviterName} of ${input.firmName} has invited you to Browseline, where you can ${ROLE_WORDS[input.role] ?? 'work together'}.`, 'Choose a password to finish setting up your account.'],
    action: { label: client ? 'Open your portal' : 'Set your password', url: input.url },
    footnote: `This link works once and expires in ${input.ttlHours} hours. If you did not expect it, you can ignore this message.`,
  });
}
