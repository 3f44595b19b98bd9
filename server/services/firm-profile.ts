/** The firm's profile as every document, e-mail and new proposal or invoice reads it. */
import type { Firm } from '../models';
import type { DocumentFirm } from '../../shared/schemas/firm';
import { firmContactLines } from '../../shared/domain/firm-contact';

export { firmDefaults, settingsFromProfile, type FirmDefaults } from '../../shared/domain/firm-defaults';

/** What a document prints about the firm now; a sent document keeps this in its snapshot. */
export function documentFirm(firm: Firm): DocumentFirm {
  return { name: firm.name, phone: firm.phone, email: firm.email, address: firm.address, website: firm.website ?? null, licenceNumbers: firm.licenceNumbers ?? null, logoKey: firm.logoKey ?? null };
}

/** The contact lines a client-facing e-mail prints under the firm's sign-off (none when the firm is unknown). */
export function emailFirmContact(firm: Firm | null | undefined): string[] {
  return firm ? firmContactLines(firm) : [];
}
