import type { User } from '../models';
import type { TeamMember } from '../../shared/schemas/auth';

/** A firm member as the team list shows them (never the password hash). */
export function presentTeamMember(user: User): TeamMember {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    clientId: user.clientId,
    status: !user.active ? 'disabled' : user.passwordHash ? 'active' : 'invited',
    lastSignInAt: user.lastSignInAt ? user.lastSignInAt.toISOString() : null,
  };
}
