import { renderEmail, type RenderedEmail } from './layout';

/** The link that confirms a new firm owner's e-mail address. */
export function signupVerifyEmail(input: { firmName: string; name: string; url: string; ttlHours: number }): RenderedEmail {
  return renderEmail({
    subject: 'Confirm your e-mail to start using Browseline',
    firmName: input.firmName,
    greeting: `Hello ${input.name},`,
    paragraphs: [`You signed up ${input.firmName} on Browseline. Confirm that this address is yours, then sign in with the password you chose.`],
    action: { label: 'Confirm my e-mail', url: input.url },
    footnote: `This link works once and expires in ${input.ttlHours} hours. If you did not sign up, ignore this message: nothing is kept unconfirmed for long.`,
  });
}

/** Sent instead when someone signs up with an address that already has an account: the page answered the same. */
export function signupExistingEmail(input: { name: string; signInUrl: string; resetUrl: string }): RenderedEmail {
  return renderEmail({
    subject: 'You already have a Browseline account',
    firmName: 'Browseline',
    greeting: `Hello ${input.name},`,
    paragraphs: [
      'Someone (we hope you) tried to sign up a new firm with this e-mail address, which already has an account. No new account was made.',
      `Sign in at ${input.signInUrl}. If you have forgotten your password, choose a new one at ${input.resetUrl}.`,
    ],
    footnote: 'If this was not you, ignore this message: your account is unchanged.',
  });
}
