import type { ClientDto } from '../../../../shared/schemas/client';
import { PortalPermissionToggle } from './portal-permission-toggle';

/** The consultant's switch: may this client's contacts upload their own files in the portal? */
export function PortalUploadsToggle({ client }: { client: ClientDto }) {
  return <PortalPermissionToggle client={client} permission="portalUploadsAllowed" label="Client may upload files in the portal" allowed="may now upload files in the portal." withdrawn="can no longer upload files." />;
}
