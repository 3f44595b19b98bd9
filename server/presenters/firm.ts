import type { Firm, Overlay } from '../models';
import type { FirmDto, OverlayDto } from '../../shared/schemas/firm';
import { DEFAULT_IDLE_TIMEOUT_HOURS, type HomeArea } from '../../shared/schemas/firm';
import { usableZone } from '../../shared/domain/clock';
import { firmDefaults } from '../../shared/domain/firm-defaults';
import { largeAreaThreshold } from '../../shared/domain/large-area';
import { observationSnapFt } from '../../shared/domain/observations';
import { LIME_METHODS, type LimeMethod } from '../../shared/domain/soil-tests';
import { retestYearsFor } from '../queries/soil-test-context';

/** The firm's soil-test settings as chosen (null method: the region's) with the default retest interval filled in. */
function soilSettings(settings: Record<string, unknown>): { limeMethod: LimeMethod | null; soilRetestYears: number } {
  const method = (LIME_METHODS as readonly unknown[]).includes(settings.limeMethod) ? (settings.limeMethod as LimeMethod) : null;
  return { limeMethod: method, soilRetestYears: retestYearsFor(settings) };
}

/** The firm and the settings the app reads. */
export function presentFirm(firm: Firm): FirmDto {
  const s = firm.settings as { tileUrlTemplate?: string | null; tileAttribution?: string | null; taxRatePct?: number; idleTimeoutHours?: number; homeArea?: HomeArea | null };
  return {
    id: firm.id,
    name: firm.name,
    email: firm.email,
    phone: firm.phone,
    region: firm.region,
    timezone: usableZone(firm.timezone),
    settings: { tileUrlTemplate: s.tileUrlTemplate ?? null, tileAttribution: s.tileAttribution ?? null, homeArea: s.homeArea ?? null, taxRatePct: s.taxRatePct ?? 0, largeAreaAcres: largeAreaThreshold(firm.settings), idleTimeoutHours: s.idleTimeoutHours ?? DEFAULT_IDLE_TIMEOUT_HOURS, observationSnapFt: observationSnapFt(firm.settings), ...soilSettings(firm.settings as Record<string, unknown>) },
    address: firm.address,
    website: firm.website ?? null,
    licenceNumbers: firm.licenceNumbers ?? null,
    // The key changes with every new logo, so the address does too and caches never show an old one.
    logoUrl: firm.logoKey ? `/api/firm/logo?v=${(firm.logoKey.split('/')[1] ?? '').slice(0, 12)}` : null,
    ...firmDefaults(firm),
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
    visible: o.visible,
    inDocuments: o.inDocuments,
    byteSize: o.byteSize,
    createdAt: o.createdAt.toISOString(),
  };
}
