import type { Firm, Overlay } from '../models';
import type { FirmDto, OverlayDto } from '../../shared/schemas/firm';
import { DEFAULT_IDLE_TIMEOUT_HOURS } from '../../shared/schemas/firm';
import { usableZone } from '../services/clock';
import { largeAreaThreshold } from '../../shared/domain/large-area';

/** The firm and the settings the app reads. */
export function presentFirm(firm: Firm): FirmDto {
  const s = firm.settings as { tileUrlTemplate?: string | null; tileAttribution?: string | null; taxRatePct?: number; idleTimeoutHours?: number };
  return {
    id: firm.id,
    name: firm.name,
    email: firm.email,
    phone: firm.phone,
    region: firm.region,
    timezone: usableZone(firm.timezone),
    settings: { tileUrlTemplate: s.tileUrlTemplate ?? null, tileAttribution: s.tileAttribution ?? null, taxRatePct: s.taxRatePct ?? 0, largeAreaAcres: largeAreaThreshold(firm.settings), idleTimeoutHours: s.idleTimeoutHours ?? DEFAULT_IDLE_TIMEOUT_HOURS },
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
