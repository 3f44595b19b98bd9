import { useState } from 'react';
import { useToast } from '../../../components/ui/toast';
import { useUpdateOverlay, type OverlayUpdateInput } from '../api/update-overlay';
import { useDeleteOverlay, useUploadOverlay, type OverlayUploadInput } from '../api/overlay-writes';
import type { OverlayDto } from '../api/get-overlays';
import type { PlanMapController } from '../lib/plan-map-controller';
import { errorText } from '../lib/error-text';

/** The aerial photos' actions on the plan map: upload with progress (fitting the view to the new photo), change, delete. */
export function usePlanOverlays(controller: PlanMapController | null, propertyId: number) {
  const toast = useToast();
  const upload = useUploadOverlay(propertyId);
  const update = useUpdateOverlay(propertyId);
  const remove = useDeleteOverlay(propertyId);
  const [progress, setProgress] = useState<number | null | undefined>(undefined);

  const onUpload = async (input: Omit<OverlayUploadInput, 'onProgress'>) => {
    setProgress(0);
    try {
      const overlay = await upload.mutateAsync({ ...input, onProgress: setProgress });
      const xs = overlay.corners.map((c) => c[0]);
      const ys = overlay.corners.map((c) => c[1]);
      controller?.fitTo([Math.min(...xs), Math.min(...ys), Math.max(...xs), Math.max(...ys)], true);
      toast('success', `${overlay.name} is on the map, under the plan.`);
    } catch (err) {
      toast('error', `${input.file.name} was not added. ${errorText(err)}`);
    } finally {
      setProgress(undefined);
    }
  };
  const onChange = (overlayId: number, input: OverlayUpdateInput) => update.mutate({ overlayId, input }, { onError: (err) => toast('error', errorText(err)) });
  const onDelete = (overlay: OverlayDto) => {
    if (!window.confirm(`Delete the photo “${overlay.name}”? The file is removed from Browseline.`)) return;
    remove.mutate(overlay.id, { onSuccess: () => toast('success', `${overlay.name} deleted.`), onError: (err) => toast('error', errorText(err)) });
  };
  const onPreview = (overlayId: number, opacity: number) => controller?.setOverlayOpacity(overlayId, opacity);
  return { progress, onUpload: (input: Omit<OverlayUploadInput, 'onProgress'>) => void onUpload(input), onChange, onDelete, onPreview };
}
