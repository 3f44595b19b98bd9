import type { Firm, Overlay } from '../models';
import { DEFAULT_IDLE_TIMEOUT_HOURS, type FirmDto, type OverlayDto } from '../../shared/schemas/firm';

/** The firm and the settings the app reads. */
export function presentFirm(firm: Firm): FirmDto {
  const s = firm.settings as { tileUrlTemplate?: string | null; tileAttribution?: string | null; taxRatePct?: number; idleTimeoutHours?: number };
  return {
    id: firm.id,
    name: firm.name,
    email: firm.email,
    phone: firm.phone,
    region: firm.region,
    settings: { tileUrlTemplate: s.tileUrlTemplate ?? null, tileAttribution: s.tileAttribution ?? null, taxRatePct: s.taxRatePct ?? 0, idleTimeoutHours: s.idleTimeoutHours ?? DEFAULT_IDLE_TIMEOUT_HOURS },
  };
}

/** An overlay with the address of its image. */
export function presentOverlay(o: Overlay): OverlayDto {
  return {
    id: o.id,
    propertyId: o.propertyId,
    name: o.name,
    imageUrl: `/api/overlays/${o.id}/image`,
    corners: o.corners,
    opacity: o.opacity,
    byteSize: o.byteSize,
    createdAt: o.createdAt.toISOString(),
  };
}
