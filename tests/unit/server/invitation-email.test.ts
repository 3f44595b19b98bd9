import { describe, expect, it } from 'vitest';
import { invitationEmail } from '../../../templates/email/invitation';
import { invitationIntro, invitationTitle } from '../../../src/features/auth/lib/invitation-words';

const base = { firmName: 'Fernhill Habitat Consulting', inviterName: 'Eli Marchetti', name: 'Priya Okonkwo', url: 'http://127.0.0.1:3000/invite/abc', ttlHours: 72 };

describe('the invitation a landowner reads', () => {
  it('offers a portal to their land, not a place on the firm’s team', () => {
    const mail = invitationEmail({ ...base, role: 'client' });
    const words = `${mail.subject}\n${mail.text}`;
    expect(mail.subject).toBe('Fernhill Habitat Consulting opened a portal for your land on Browseline');
    expect(words).toContain('see the plan for your land');
    expect(words).not.toMatch(/team|invited you to Fernhill/i);
    expect(invitationTitle('client')).toBe('Your land’s portal on Browseline');
    expect(invitationIntro({ role: 'client', name: 'Priya', firmName: base.firmName, email: 'p@example.test' })).not.toMatch(/team/i);
  });

  it('still asks crew and consultants to join the firm', () => {
    expect(invitationEmail({ ...base, role: 'crew' }).subject).toBe('Eli Marchetti invited you to Fernhill Habitat Consulting on Browseline');
    expect(invitationTitle('crew')).toBe('Join your team on Browseline');
  });
});
