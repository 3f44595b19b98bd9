import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { OverlayDto } from './get-overlays';
import { planMapKeys } from './keys';

/** What can change on an overlay: its name, opacity, whether the map shows it, whether documents print it. */
export type OverlayUpdateInput = { opacity?: number; name?: string; visible?: boolean; inDocuments?: boolean };

/** PATCH /api/overlays/:id. */
export async function updateOverlay(overlayId: number, input: OverlayUpdateInput): Promise<OverlayDto> {
  const body = await api.patch<{ data: OverlayDto }>(`/api/overlays/${overlayId}`, input);
  return body.data;
}

/** Saves an overlay's change (the map already shows an opacity change). */
export function useUpdateOverlay(propertyId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ overlayId, input }: { overlayId: number; input: OverlayUpdateInput }) => updateOverlay(overlayId, input),
    onSuccess: (overlay) =>
      qc.setQueryData<OverlayDto[]>(planMapKeys.overlays(propertyId), (old) => (old ?? []).map((o) => (o.id === overlay.id ? overlay : o))),
  });
}
