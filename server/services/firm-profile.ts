/** The firm's profile as every document, e-mail and new proposal or invoice reads it. */
import type { Firm } from '../models';
import type { DocumentFirm } from '../../shared/schemas/firm';
import { DEFAULT_TERMS_DAYS } from '../../shared/domain/invoicing';
import { firmContactLines } from '../../shared/domain/firm-contact';

/** Defaults the firm can change on its profile, with the values a new firm starts with. */
export interface FirmDefaults {
  defaultDepositPct: number;
  paymentTermsDays: number;
  proposalValidDays: number;
  taxRatePct: number;
  areaUnit: 'acres' | 'hectares';
  lengthUnit: 'feet' | 'metres';
}

/** Keys in `firms.settings` (the first two were read there before the profile existed). */
interface StoredSettings {
  depositPct?: number;
  invoiceTermsDays?: number;
  proposalValidDays?: number;
  taxRatePct?: number;
  areaUnit?: 'acres' | 'hectares';
  lengthUnit?: 'feet' | 'metres';
}

/** The firm's defaults with a new firm's values where unset (30 % deposit, 30-day terms and validity, no tax, acres and feet). */
export function firmDefaults(firm: Pick<Firm, 'settings'> | null | undefined): FirmDefaults {
  const s = (firm?.settings ?? {}) as StoredSettings;
  return {
    defaultDepositPct: s.depositPct ?? 30,
    paymentTermsDays: s.invoiceTermsDays ?? DEFAULT_TERMS_DAYS,
    proposalValidDays: s.proposalValidDays ?? 30,
    taxRatePct: s.taxRatePct ?? 0,
    areaUnit: s.areaUnit ?? 'acres',
    lengthUnit: s.lengthUnit ?? 'feet',
  };
}

/** The settings keys a profile change writes, from the API's names. */
export function settingsFromProfile(input: Partial<FirmDefaults>): StoredSettings {
  const out: StoredSettings = {};
  if (input.defaultDepositPct !== undefined) out.depositPct = input.defaultDepositPct;
  if (input.paymentTermsDays !== undefined) out.invoiceTermsDays = input.paymentTermsDays;
  if (input.proposalValidDays !== undefined) out.proposalValidDays = input.proposalValidDays;
  if (input.taxRatePct !== undefined) out.taxRatePct = input.taxRatePct;
  if (input.areaUnit !== undefined) out.areaUnit = input.areaUnit;
  if (input.lengthUnit !== undefined) out.lengthUnit = input.lengthUnit;
  return out;
}

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
