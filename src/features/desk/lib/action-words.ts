/**
 * Words for the Desk's activity list. Kept out of lib/format (which every page's first load carries,
 * the field sheet too) because only the Desk shows them.
 */
const ACTION_WORDS: Record<string, string> = {
  'client.created': 'added a client',
  'user.invited': 'sent an invitation',
  'user.joined': 'joined the firm',
  'user.password-reset': 'reset a password',
  'user.disabled': 'disabled an account',
  'user.enabled': 'enabled an account',
  'firm.signed-up': 'set up the firm on Browseline',
  'user.email-confirmed': 'confirmed their e-mail address',
  'firm.profile-changed': 'updated the firm profile',
  'firm.logo-changed': 'changed the firm logo',
};
/** An audit action as a phrase after the person's name, such as 'added a client'. */
export const describeAction = (action: string): string => ACTION_WORDS[action] ?? action.replace(/[.-]/g, ' ');
