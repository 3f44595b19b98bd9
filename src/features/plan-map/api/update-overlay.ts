import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { OverlayDto } from './get-overlays';
import { planMapKeys } from './keys';

/** PATCH /api/overlays/:id {opacity?, name?}. */
export async function updateOverlay(overlayId: number, input: { opacity?: number; name?: string }): Promise<OverlayDto> {
  const body = await api.patch<{ data: OverlayDto }>(`/api/overlays/${overlayId}`, input);
  return body.data;
}

/** Saves an overlay's opacity (the map already shows it). */
export function useUpdateOverlay(propertyId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ overlayId, input }: { overlayId: number; input: { opacity?: number; name?: string } }) => updateOverlay(overlayId, input),
    onSuccess: (overlay) =>
      qc.setQueryData<OverlayDto[]>(planMapKeys.overlays(propertyId), (old) => (old ?? []).map((o) => (o.id === overlay.id ? overlay : o))),
  });
}
