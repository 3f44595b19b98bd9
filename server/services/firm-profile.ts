/** The firm's profile as every document, e-mail and new proposal or invoice reads it. */
import type { Firm } from '../models';
import type { DocumentFirm } from '../../shared/schemas/firm';
import { firmContactLines } from '../../shared/domain/firm-contact';

import { firmDefaults } from '../../shared/domain/firm-defaults';
export { firmDefaults, settingsFromProfile, type FirmDefaults } from '../../shared/domain/firm-defaults';

/** What a document prints about the firm now; a sent document keeps this in its snapshot. */
export function documentFirm(firm: Firm): DocumentFirm {
  const { areaUnit, lengthUnit } = firmDefaults(firm);
  return { name: firm.name, phone: firm.phone, email: firm.email, address: firm.address, website: firm.website ?? null, licenceNumbers: firm.licenceNumbers ?? null, logoKey: firm.logoKey ?? null, areaUnit, lengthUnit };
}

/** The contact lines a client-facing e-mail prints under the firm's sign-off (none when the firm is unknown). */
export function emailFirmContact(firm: Firm | null | undefined): string[] {
  return firm ? firmContactLines(firm) : [];
}

/**
 * Whether the firm has chosen where it works. The home area is kept in `firms.settings.homeArea`
 * (any non-empty value: counties picked, or a bounding box); until it is set, the Desk's first steps
 * keep it open.
 */
export function hasHomeArea(firm: Pick<Firm, 'settings'>): boolean {
  const value = (firm.settings ?? {}).homeArea;
  if (value === null || value === undefined) return false;
  if (Array.isArray(value)) return value.length > 0;
  if (typeof value === 'object') return Object.keys(value as object).length > 0;
  return Boolean(value);
}
