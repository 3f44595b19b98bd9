import type { ClientDto } from '../../../../shared/schemas/client';
import { useUpdateClient } from '../api/update-client';
import { useToast } from '../../../components/ui/toast';

/** The consultant's switch: may this client's contacts upload their own files in the portal? */
export function PortalUploadsToggle({ client }: { client: ClientDto }) {
  const update = useUpdateClient();
  const toast = useToast();
  return (
    <label className="flex items-center gap-2 text-sm">
      <input
        type="checkbox"
        className="h-4 w-4 accent-moss"
        checked={client.portalUploadsAllowed}
        disabled={update.isPending}
        onChange={(e) =>
          update.mutate(
            { id: client.id, input: { portalUploadsAllowed: e.target.checked } },
            {
              onSuccess: (c) => toast('success', c.portalUploadsAllowed ? `${c.name} may now upload files in the portal.` : `${c.name} can no longer upload files.`),
              onError: (err) => toast('error', `Not changed: ${err.message}`),
            },
          )
        }
      />
      Client may upload files in the portal
    </label>
  );
}
