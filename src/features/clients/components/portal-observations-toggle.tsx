import type { ClientDto } from '../../../../shared/schemas/client';
import { PortalPermissionToggle } from './portal-permission-toggle';

/** The consultant's switch: may this client’s contacts log field observations on their own land in the portal? */
export function PortalObservationsToggle({ client }: { client: ClientDto }) {
  return <PortalPermissionToggle client={client} permission="portalObservationsAllowed" label="Client may log field observations (signs, photos) in the portal" allowed="may now log field observations on their land in the portal." withdrawn="can no longer log field observations." />;
}
