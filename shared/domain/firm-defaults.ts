/** The firm's profile defaults (deposit, terms, validity, tax, units) read from its stored settings. Pure. */
import { DEFAULT_TERMS_DAYS } from './invoicing';

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
export interface StoredSettings {
  depositPct?: number;
  invoiceTermsDays?: number;
  proposalValidDays?: number;
  taxRatePct?: number;
  areaUnit?: 'acres' | 'hectares';
  lengthUnit?: 'feet' | 'metres';
}

/** The firm's defaults with a new firm's values where unset (30 % deposit, 30-day terms and validity, no tax, acres and feet). */
export function firmDefaults(firm: { settings?: unknown } | null | undefined): FirmDefaults {
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
