/** The heading of the accept-invitation page: a landowner opens their portal; staff and crew join the firm's team. */
export function invitationTitle(role: string | undefined): string {
  if (role === undefined) return 'Welcome to Browseline';
  return role === 'client' ? 'Your land’s portal on Browseline' : 'Join your team on Browseline';
}

/** The sentence under the heading. */
export function invitationIntro(input: { role: string; name: string; firmName: string; email: string }): string {
  return input.role === 'client'
    ? `Welcome, ${input.name}. ${input.firmName} has set up a portal for ${input.email} where you can follow the plan for your land. Choose a password to open it.`
    : `Welcome, ${input.name}. ${input.firmName} invited ${input.email}. Choose a password to finish.`;
}
