import { queryOptions, useQuery } from '@tanstack/react-query';
import { getData } from '../../../lib/api-client';
import type { TeamMember } from '../../../../shared/schemas/auth';

/** A landowner's account for the read-only portal (a team member with the client role). */
export type ClientContact = TeamMember;

/** The portal contacts of one client. */
export const getClientContacts = (clientId: number, signal?: AbortSignal) => getData<ClientContact[]>(`/api/clients/${clientId}/contacts`, signal);

export const getClientContactsQueryOptions = (clientId: number) =>
  queryOptions({ queryKey: ['clients', 'detail', clientId, 'contacts'], queryFn: ({ signal }) => getClientContacts(clientId, signal) });

/** The portal contacts of one client. */
export const useClientContacts = (clientId: number) => useQuery(getClientContactsQueryOptions(clientId));
