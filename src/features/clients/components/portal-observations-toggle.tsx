import type { ClientDto } from '../../../../shared/schemas/client';
import { useUpdateClient } from '../api/update-client';
import { useToast } from '../../../components/ui/toast';

/** The consultant's switch: may this client’s contacts log field observations on their own land in the portal? */
export function PortalObservationsToggle({ client }: { client: ClientDto }) {
  const update = useUpdateClient();
  const toast = useToast();
  return (
    <label className="flex items-center gap-2 text-sm">
      <input
        type="checkbox"
        className="h-4 w-4 accent-moss"
        checked={client.portalObservationsAllowed}
        disabled={update.isPending}
        onChange={(e) =>
          update.mutate(
            { id: client.id, input: { portalObservationsAllowed: e.target.checked } },
            {
              onSuccess: (c) => toast('success', c.portalObservationsAllowed ? `${c.name} may now log field observations on their land in the portal.` : `${c.name} can no longer log field observations.`),
              onError: (err) => toast('error', `Not changed: ${err.message}`),
            },
          )
        }
      />
      Client may log field observations (signs, photos) in the portal
    </label>
  );
}
