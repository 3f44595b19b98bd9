import type { ClientDto } from '../../../../shared/schemas/client';
import { useUpdateClient } from '../api/update-client';
import { useToast } from '../../../components/ui/toast';

/** A client's portal permissions the consultant can switch. */
export type PortalPermission = 'portalObservationsAllowed' | 'portalUploadsAllowed';

/** The consultant's switch for one portal permission of a client, with the toasts that say what changed. */
export function PortalPermissionToggle({ client, permission, label, allowed, withdrawn }: {
  client: ClientDto;
  permission: PortalPermission;
  /** The checkbox's label. */
  label: string;
  /** The toast once allowed, e.g. "may now upload files in the portal." (after the client's name). */
  allowed: string;
  /** The toast once withdrawn, e.g. "can no longer upload files." */
  withdrawn: string;
}) {
  const update = useUpdateClient();
  const toast = useToast();
  return (
    <label className="flex items-center gap-2 text-sm">
      <input
        type="checkbox"
        className="h-4 w-4 accent-moss"
        checked={client[permission]}
        disabled={update.isPending}
        onChange={(e) =>
          update.mutate(
            { id: client.id, input: { [permission]: e.target.checked } },
            {
              onSuccess: (c) => toast('success', `${c.name} ${c[permission] ? allowed : withdrawn}`),
              onError: (err) => toast('error', `Not changed: ${err.message}`),
            },
          )
        }
      />
      {label}
    </label>
  );
}
