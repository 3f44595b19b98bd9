/** Changes to the firm's own record: its settings, its profile and its logo, each locked, in a transaction, with its audit record. */
import type { Transaction } from 'sequelize';
import type { z } from 'zod';
import { sequelize } from '../db/sequelize';
import { Firm } from '../models';
import type { SessionUser } from '../../shared/schemas/auth';
import type { FirmProfileUpdateSchema, FirmSettingsUpdateInput } from '../../shared/schemas/firm';
import { settingsFromProfile } from '../services/firm-profile';
import { notFound } from '../errors';
import { recordAudit } from './audit-recorder';

type FirmProfileUpdate = z.output<typeof FirmProfileUpdateSchema>;

/** Locks the actor's firm, applies `change` and records `action` with `data`, all in one transaction. */
async function changeFirm(me: SessionUser, action: string, data: Record<string, unknown>, ip: string | null, change: (row: Firm, transaction: Transaction) => Promise<unknown>): Promise<Firm> {
  return sequelize.transaction(async (transaction) => {
    const row = await Firm.findByPk(me.firmId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!row) throw notFound('Your firm');
    await change(row, transaction);
    await recordAudit({ firmId: me.firmId, userId: me.id, action, subjectType: 'Firm', subjectId: me.firmId, data, ip }, transaction);
    return row;
  });
}

/** Sets the given settings (and the time zone), keeping every other setting. */
export async function updateFirmSettings(me: SessionUser, input: FirmSettingsUpdateInput, ip: string | null): Promise<Firm> {
  return changeFirm(me, 'firm.settings-changed', { keys: Object.keys(input) }, ip, async (row, transaction) => {
    const { timezone, ...rest } = input;
    const settings = { ...row.settings };
    for (const [key, value] of Object.entries(rest)) if (value !== undefined) settings[key] = value;
    await row.update({ settings, ...(timezone !== undefined ? { timezone } : {}) }, { transaction });
  });
}

/** The profile: what documents and e-mails print, and the defaults of new proposals and invoices. */
export async function updateFirmProfile(me: SessionUser, input: FirmProfileUpdate, ip: string | null): Promise<Firm> {
  return changeFirm(me, 'firm.profile-changed', { keys: Object.keys(input) }, ip, async (row, transaction) => {
    const { name, address, phone, email, website, licenceNumbers, timezone, ...defaults } = input;
    const columns = Object.fromEntries(Object.entries({ name, address, phone, email, website, licenceNumbers, timezone }).filter(([, v]) => v !== undefined));
    await row.update({ ...columns, settings: { ...row.settings, ...settingsFromProfile(defaults) } }, { transaction });
  });
}

/** Points the firm at a logo already stored under `key` (a new key each time, so sent documents keep theirs). */
export async function setFirmLogo(me: SessionUser, logo: { key: string; contentType: string; width: number; height: number }, ip: string | null): Promise<Firm> {
  return changeFirm(me, 'firm.logo-changed', { width: logo.width, height: logo.height }, ip, async (row, transaction) => {
    await row.update({ logoKey: logo.key, logoContentType: logo.contentType }, { transaction });
  });
}
